// One element on the drawing: its symbol in the single ink weight (rotated in quarter turns), a run's conductors
// drawn apart in the sheet's phase colours with open ones marked, its name and size, and its live state named.
import { memo } from 'react';
import { G, Path, Text } from 'react-native-svg';
import { placeText, quarterTurns, INK_WIDTH, type ConductorLane } from '@/shared/symbols';
import type { PlacedElement } from '@/editor/canvas/scene';
import type { ElementStatus } from '@/editor/results/value-tags';
import { fontFamily, type ConductorInk, type ConductorName, type DrawingPalette } from '../theme/tokens';
import { elementDetail } from './element-detail';

export interface ElementSymbolProps {
  placed: PlacedElement;
  palette: DrawingPalette;
  conductors: Record<ConductorName, ConductorInk>;
  status?: ElementStatus;
  /** Conductors of this run open in the case on show. */
  openConductors?: string;
  /** Named by a solve failure or an invalid field. */
  error?: boolean;
  showLabel: boolean;
}

const BADGE_WIDTH = 78;
const STATE_WORD: Record<string, string> = { 'back-fed': 'BACK-FED', 'de-energised': 'DE-ENERGISED', 'partly-energised': 'PARTLY LIVE' };

function Lane({ lane, ink, open, baseInk, cut }: { lane: ConductorLane; ink: ConductorInk; open: boolean; baseInk: string; cut: string }) {
  const { from, to } = lane;
  const fans = `M ${lane.fanIn.x} ${lane.fanIn.y} L ${from.x} ${from.y} M ${to.x} ${to.y} L ${lane.fanOut.x} ${lane.fanOut.y}`;
  const midY = (from.y + to.y) / 2;
  const body = open ? `M ${from.x} ${from.y} L ${from.x} ${midY - 5} M ${to.x} ${midY + 5} L ${to.x} ${to.y}` : `M ${from.x} ${from.y} L ${to.x} ${to.y}`;
  return (
    <G>
      <Path d={fans} stroke={baseInk} strokeWidth={1} fill="none" />
      {ink.casing ? <Path d={body} stroke={ink.casing} strokeWidth={INK_WIDTH + 1.6} fill="none" /> : null}
      <Path d={body} stroke={ink.stroke} strokeWidth={INK_WIDTH} fill="none" />
      {ink.stripe ? <Path d={body} stroke={ink.stripe} strokeWidth={INK_WIDTH} strokeDasharray="3 3" fill="none" /> : null}
      {open ? <Path d={`M ${from.x - 4} ${midY - 4} L ${from.x + 4} ${midY + 4} M ${from.x + 4} ${midY - 4} L ${from.x - 4} ${midY + 4}`} stroke={cut} strokeWidth={INK_WIDTH} /> : null}
    </G>
  );
}

function FarLane({ lane, ink }: { lane: ConductorLane; ink: string }) {
  const d = `M ${lane.fanIn.x} ${lane.fanIn.y} L ${lane.from.x} ${lane.from.y} L ${lane.to.x} ${lane.to.y} L ${lane.fanOut.x} ${lane.fanOut.y}`;
  return <Path d={d} stroke={ink} strokeWidth={INK_WIDTH} fill="none" />;
}

function ElementSymbolView({ placed, palette, conductors, status, openConductors, error, showLabel }: ElementSymbolProps) {
  const { element, symbol } = placed;
  const turns = quarterTurns(element.rotationDeg);
  const dead = status?.state === 'de-energised';
  const hazard = status?.state === 'back-fed';
  const ink = dead ? palette.inkDead : hazard ? palette.hazard : palette.ink;
  const open = new Set((openConductors ?? '').split(',').filter(Boolean));
  const label = placeText(element, symbol.label);
  const anchor = label.align;
  const detail = showLabel ? elementDetail(element) : '';
  const stateWord = status && (status.backFed ? `${status.backFed} BACK-FED` : STATE_WORD[status.state]);
  const name = element.name || element.id;
  // The state's badge sits clear of the symbol: above a bar's right end, else beside the body.
  const badge = element.kind === 'bus' ? { x: placed.body.x + placed.body.width - BADGE_WIDTH, y: placed.body.y - 18 } : { x: placed.body.x + placed.body.width + 6, y: placed.body.y + placed.body.height / 2 - 7 };
  return (
    <G testID={`el-${element.id}`} aria-label={`${name}${stateWord ? `, ${stateWord.toLowerCase()}` : ''}`}>
      <G testID={`sym-${element.id}`} transform={`translate(${element.x} ${element.y}) rotate(${turns * 90})`}>
        {error ? <Path d={symbol.ink} stroke={palette.error} strokeWidth={INK_WIDTH + 6} strokeOpacity={0.35} fill="none" /> : null}
        <Path
          d={symbol.ink}
          stroke={ink}
          strokeWidth={INK_WIDTH}
          strokeDasharray={dead ? '5 4' : undefined}
          strokeLinejoin="round"
          strokeLinecap="round"
          fill="none"
        />
        {/* Far out the lanes are under a pixel apart: one line stands for them all (a gap would read as open),
            and only an open lane, with its cut mark, is drawn on its own. */}
        {!showLabel && symbol.lanes.length ? <FarLane lane={symbol.lanes[Math.floor(symbol.lanes.length / 2)]} ink={ink} /> : null}
        {(showLabel ? symbol.lanes : symbol.lanes.filter((l) => open.has(l.conductor))).map((lane) => (
          <Lane key={lane.conductor} lane={lane} ink={conductors[lane.conductor]} open={open.has(lane.conductor)} baseInk={ink} cut={palette.error} />
        ))}
        {symbol.glyph ? (
          <Text
            x={symbol.glyph.x}
            y={symbol.glyph.y + 5}
            fontSize={14}
            fontFamily={fontFamily.semibold}
            textAnchor="middle"
            fill={ink}
            transform={turns ? `rotate(${-turns * 90} ${symbol.glyph.x} ${symbol.glyph.y})` : undefined}
          >
            {symbol.glyph.text}
          </Text>
        ) : null}
      </G>
      {showLabel ? (
        <Text x={label.x} y={label.y} fontSize={12} fontFamily={fontFamily.medium} textAnchor={anchor} fill={dead ? palette.inkDead : palette.label}>
          {name.length > 32 ? `${name.slice(0, 31)}…` : name}
        </Text>
      ) : null}
      {detail ? (
        <Text x={label.x} y={label.y + 14} fontSize={11} fontFamily={fontFamily.mono} textAnchor={anchor} fill={palette.terminal}>
          {detail}
        </Text>
      ) : null}
      {stateWord ? (
        <G testID={`state-${element.id}`}>
          <Path
            d={`M ${badge.x} ${badge.y} h ${BADGE_WIDTH} v 14 h ${-BADGE_WIDTH} Z`}
            stroke={hazard ? palette.hazard : palette.inkDead}
            strokeWidth={hazard ? 2 : 1}
            strokeDasharray={dead ? '3 2' : undefined}
            fill={palette.ground}
          />
          <Text x={badge.x + BADGE_WIDTH / 2} y={badge.y + 10.5} fontSize={9} fontFamily={fontFamily.semibold} textAnchor="middle" fill={hazard ? palette.hazard : palette.inkDead}>
            {stateWord}
          </Text>
        </G>
      ) : null}
      {status?.ungrounded && !dead ? (
        // Under the name and size, except on a bus, whose bar runs under its name: there it goes above.
        <Text x={label.x} y={element.kind === 'bus' ? label.y - 14 : label.y + (detail ? 28 : 14)} testID={`ungrounded-${element.id}`} fontSize={10} fontFamily={fontFamily.semibold} textAnchor={anchor} fill={palette.hazard}>
          UNGROUNDED
        </Text>
      ) : null}
    </G>
  );
}

export const ElementSymbol = memo(ElementSymbolView);

/** Where to draw a terminal's open ring (those with nothing connected yet). */
export function terminalRings(placed: PlacedElement, connected: ReadonlySet<string>): { x: number; y: number }[] {
  return placed.terminals.filter((t) => !t.bar && !connected.has(`${placed.element.id}|${t.name}`)).map((t) => t.point);
}
