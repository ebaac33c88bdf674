// Pins for a screen that shows a sheet (the editor or a viewer link's page): the pins read and kept live, their
// flags' places on the drawing as the view moves, the pin tool (the next tap on the canvas picks an element or a
// point), the thread on show, and the changes (new pin, reply, resolve, attachment). Returns the props of the pin
// layer and the pin panel.
import { useCallback, useEffect, useMemo, useState } from 'react';
import type { PinPlace, PinThread } from '../../shared/client/api-client';
import { getApiClient } from '../../shared/client/queries';
import { useAddPin, useAttachToPin, usePinEvents, usePins, useReplyToPin, useResolvePin } from '../../shared/client/pin-queries';
import type { Point } from '../../shared/symbols';
import { screenToWorld, worldToScreen, type Viewport } from '../canvas/viewport';
import { pinAnchor, pinTargetAt, type PinPosition } from '../pins/pin-anchor';
import type { Scene } from '../canvas/scene';
import type { EditorHandle } from './use-sheet-editor';

export interface PinBoardOptions {
  handle: EditorHandle | null;
  place: PinPlace | null;
  scene: Scene;
  nameOf: (elementId: string) => string;
  /** Who would write: null when nobody is signed in (a visitor must give a name first). */
  me: { id: string } | null;
  /** Editors and owners resolve anyone's pin; others only their own. */
  canModerate: boolean;
  /** Shows the pin panel (the phone's sliding panel; on a wide screen it is always in the side pane). */
  showPanel: () => void;
  /** Clears the canvas for the tap that places a pin (a phone's panel would cover it). */
  hidePanel: () => void;
  /** A pin to open once the pins are read (?pin=3 in the e-mailed link). */
  initialPinNumber?: number | null;
  pickFile: () => Promise<File | null>;
  /** The share of the canvas's height left in sight when the pin panel is open (a phone's panel covers the rest). */
  visibleShare: number;
}

function useViewport(handle: EditorHandle | null) {
  const [state, setState] = useState<{ viewport: Viewport; size: { width: number; height: number } }>({
    viewport: { x: 0, y: 0, zoom: 1 },
    size: { width: 0, height: 0 },
  });
  useEffect(() => {
    if (!handle) return;
    const read = () => setState({ viewport: { ...handle.canvas.viewport }, size: handle.canvas.viewSize });
    read();
    return handle.canvas.onViewport(read);
  }, [handle]);
  return state;
}

const errorText = (e: unknown) => (e instanceof Error ? e.message : e ? 'Something went wrong.' : null);

export function usePinBoard(o: PinBoardOptions) {
  const { handle, place } = o;
  const pins = usePins(place);
  usePinEvents(place);
  const add = useAddPin(place ?? { sheetId: '' });
  const reply = useReplyToPin(place ?? { sheetId: '' });
  const resolve = useResolvePin(place ?? { sheetId: '' });
  const attach = useAttachToPin(place ?? { sheetId: '' });
  const { viewport, size } = useViewport(handle);
  const [placing, setPlacing] = useState(false);
  const [draft, setDraft] = useState<PinPosition | null>(null);
  const [openId, setOpenId] = useState<string | null>(null);
  const [attachError, setAttachError] = useState<string | null>(null);
  const [openedInitial, setOpenedInitial] = useState(false);

  const list = useMemo(() => pins.data ?? [], [pins.data]);
  const openPin = list.find((p) => p.id === openId) ?? null;
  const placeOf = useCallback((p: Pick<PinThread, 'elementId'>) => (p.elementId ? `on ${o.nameOf(p.elementId)}` : 'on the sheet'), [o.nameOf]);

  useEffect(() => {
    if (openedInitial || !o.initialPinNumber || !pins.data) return;
    setOpenedInitial(true);
    const found = pins.data.find((p) => p.number === o.initialPinNumber);
    if (found) {
      setOpenId(found.id);
      o.showPanel();
    }
  }, [openedInitial, o.initialPinNumber, pins.data, o]);

  const marks = useMemo(
    () =>
      list.map((p) => ({
        id: p.id,
        number: p.number,
        resolved: p.resolvedAt !== null,
        at: pinAnchor(p, o.scene),
        label: `${p.body.slice(0, 60)} (${placeOf(p)})`,
      })),
    [list, o.scene, placeOf],
  );

  // Brings a pin's flag into the part of the canvas left in sight (below the legend, above a phone's panel).
  const reveal = useCallback(
    (at: Point) => {
      if (!handle) return;
      const vp = handle.canvas.viewport;
      const { width, height } = handle.canvas.viewSize;
      if (width <= 0 || height <= 0) return;
      const bottom = height * o.visibleShare;
      const top = Math.min(130, bottom / 3);
      const s = worldToScreen(vp, at);
      // The flag rises about 36 px above the point it stands on.
      if (s.x >= 24 && s.x <= width - 48 && s.y - 36 >= top && s.y <= bottom - 8) return;
      handle.canvas.setViewport({ x: vp.x + (width / 2 - s.x), y: vp.y + ((top + bottom) / 2 + 18 - s.y), zoom: vp.zoom });
    },
    [handle, o.visibleShare],
  );

  const startPin = useCallback(() => {
    setDraft(null);
    setOpenId(null);
    setPlacing(true);
    // A visitor gives a name first, in the panel; anyone else taps the canvas at once.
    if (!o.me) o.showPanel();
    else if (o.visibleShare < 1) o.hidePanel();
  }, [o]);

  const placeAt = useCallback(
    (screen: Point) => {
      if (!handle) return;
      const world = screenToWorld(handle.canvas.viewport, screen);
      const target = pinTargetAt(handle.canvas.sceneIndex(), world, handle.canvas.viewport.zoom);
      setDraft(target);
      setPlacing(false);
      o.showPanel();
      reveal(pinAnchor(target, o.scene));
    },
    [handle, o, reveal],
  );

  const open = useCallback(
    (pinId: string | null) => {
      setOpenId(pinId);
      setDraft(null);
      setAttachError(null);
      if (!pinId) return;
      o.showPanel();
      const pin = list.find((p) => p.id === pinId);
      if (pin) reveal(pinAnchor(pin, o.scene));
    },
    [o, list, reveal],
  );

  const post = useCallback(
    async (text: string) => {
      if (!draft) return;
      const created = await add.mutateAsync({ body: text, elementId: draft.elementId, x: draft.x, y: draft.y });
      setDraft(null);
      setOpenId(created.id);
      reveal(pinAnchor(draft, o.scene));
    },
    [add, draft, reveal, o.scene],
  );

  const onAttach = useCallback(async () => {
    if (!openPin) return;
    setAttachError(null);
    const file = await o.pickFile();
    if (!file) return;
    try {
      await attach.mutateAsync({ pinId: openPin.id, file, fileName: file.name });
    } catch (e) {
      setAttachError(errorText(e));
    }
  }, [attach, openPin, o]);

  const mine = openPin ? openPin.author.id !== null && openPin.author.id === o.me?.id : false;

  return {
    placing,
    startPin,
    cancelPlacing: () => setPlacing(false),
    layer: {
      pins: marks,
      viewport,
      size,
      openId,
      placing: placing && !!o.me,
      onOpen: open,
      onPlace: placeAt,
      onCancelPlacing: () => setPlacing(false),
    },
    panel: {
      pins: list,
      loading: pins.isPending && !!place,
      error: errorText(pins.error),
      placeOf,
      openPin,
      draft: draft ? placeOf(draft) : null,
      canWrite: !!o.me,
      placing,
      posting: add.isPending,
      thread: {
        canResolve: o.canModerate || mine,
        attachmentUrl: (attachmentId: string) => (place && openPin ? getApiClient().attachmentUrl(place, openPin.id, attachmentId) : ''),
        replying: reply.isPending,
        resolving: resolve.isPending,
        attaching: attach.isPending,
        attachError: attachError ?? errorText(resolve.error),
        onReply: (text: string) => (openPin ? reply.mutateAsync({ pinId: openPin.id, body: text }) : Promise.resolve()),
        onResolve: (resolved: boolean) => openPin && resolve.mutate({ pinId: openPin.id, resolved }),
        onAttach: () => void onAttach(),
      },
      onOpen: open,
      onStartPin: startPin,
      onPost: post,
      onCancelDraft: () => setDraft(null),
    },
  };
}

export type PinBoard = ReturnType<typeof usePinBoard>;
