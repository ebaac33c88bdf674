// Marks over the drawing for a case shown from a study: where a shunt fault is placed (with its type and current)
// and, for a readings match, the candidate cause. Also the view change that brings a marked element into sight
// above a panel that covers the lower part of the canvas.
import type { Rect } from '../../shared/symbols';
import type { WhatIfChange } from '../../shared/sheet';
import type { SolveResult } from '../../solver';
import type { Viewport } from '../canvas/viewport';
import { FAULT_TYPE_SHORT } from './fault-labels';
import { formatKa } from './fault-study-rows';

const ohmsText = (ohms: number) => (ohms < 10 ? ohms.toFixed(2) : ohms.toFixed(1));

export interface CaseMark {
  key: string;
  kind: 'fault' | 'candidate';
  elementId: string;
  /** The mark's anchor on the drawing: the left middle of the element's body. */
  x: number;
  y: number;
  label: string;
}

/**
 * The marks of the case on show: its shunt fault, and any connection it opens or degrades (a lug: not otherwise
 * drawn, unlike an open run conductor), at the element the connection lands on.
 */
export function caseMarks(
  result: SolveResult | null,
  bodyOf: (id: string) => Rect | undefined,
  changes: readonly WhatIfChange[] = [],
  landingOf: (connectionId: string) => string | undefined = () => undefined,
): CaseMark[] {
  const marks: CaseMark[] = [];
  for (const c of changes) {
    if (c.kind === 'degrade-conductor') {
      // A resistance in series with a run's conductor (a failing splice): not drawn otherwise, unlike an opening.
      const body = bodyOf(c.runId);
      if (body) marks.push({ key: `splice-${c.runId}-${c.conductor}`, kind: 'candidate', elementId: c.runId, x: body.x, y: body.y + body.height / 2, label: `${ohmsText(c.addedOhms)} Ω in ${c.conductor}` });
      continue;
    }
    if (c.kind !== 'open-connection' && c.kind !== 'degrade-connection') continue;
    const elementId = landingOf(c.connectionId);
    const body = elementId ? bodyOf(elementId) : undefined;
    if (!elementId || !body) continue;
    const label = c.kind === 'open-connection' ? `${c.conductor} open at this lug` : `${ohmsText(c.ohms)} Ω on ${c.conductor} at this lug`;
    marks.push({ key: `lug-${c.connectionId}-${c.conductor}`, kind: 'candidate', elementId, x: body.x, y: body.y + body.height / 2, label });
  }
  const fault = result?.fault;
  if (!fault) return marks;
  const body = bodyOf(fault.busId);
  if (!body) return marks;
  return [
    ...marks,
    {
      key: `fault-${fault.busId}`,
      kind: 'fault',
      elementId: fault.busId,
      x: body.x,
      y: body.y + body.height / 2,
      label: `${FAULT_TYPE_SHORT[fault.faultType]} fault ${formatKa(fault.symmetricalKa)} kA`,
    },
  ];
}

/**
 * The viewport that brings `rect` (drawing units) into the visible part of the canvas (its top `visibleFraction`),
 * placed a little below that part's middle (the messages sit at the top), zoomed in to at least `minZoom` so that
 * its value tags are drawn; the viewport unchanged when it is already in sight at that zoom.
 */
export function revealViewport(vp: Viewport, size: { width: number; height: number }, rect: Rect, visibleFraction: number, minZoom = 0): Viewport {
  const visibleHeight = size.height * visibleFraction;
  const zoom = Math.max(vp.zoom, minZoom);
  const left = rect.x * vp.zoom + vp.x;
  const top = rect.y * vp.zoom + vp.y;
  const right = left + rect.width * vp.zoom;
  const bottom = top + rect.height * vp.zoom;
  const margin = 16;
  if (zoom === vp.zoom && left >= margin && right <= size.width - margin && top >= margin && bottom <= visibleHeight - margin) return vp;
  const cx = rect.x + rect.width / 2;
  const cy = rect.y + rect.height / 2;
  return { zoom, x: size.width / 2 - cx * zoom, y: visibleHeight * 0.6 - cy * zoom };
}
