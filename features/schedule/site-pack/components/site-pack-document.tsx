import { Fragment } from 'react';
import { Document, G, Line, Page, Path, Rect, StyleSheet, Svg, Text, View } from '@react-pdf/renderer';

import { DIAGRAM, layoutSite, type PlacedBoard } from '@/components/site-diagram/layout';
import { EARTHING_NAMES, fedFromWords, selectivityWords, SUPPLY_SOURCE_NAMES, VERDICT_WORDS } from '@/lib/names';
import { groupSelectivity, placesWords, type SiteBoardResult, type SiteResult, type Working } from '@/lib/supply';

import { PRINT_FONT } from '../../utils/fonts';
import { PRINT_INK as INK, PRINT_SOFT as SOFT, VERDICT_TONES as VERDICT_INK } from '../../utils/print-palette';

const LINE = '#b9b2a3';

const styles = StyleSheet.create({
  page: {
    fontFamily: PRINT_FONT,
    fontSize: 9,
    color: INK,
    paddingTop: 36,
    paddingBottom: 60,
    paddingHorizontal: 36,
  },
  title: { fontSize: 15, fontWeight: 700, marginBottom: 2 },
  subtitle: { fontSize: 9, color: SOFT, marginBottom: 10 },
  heading: { fontSize: 11, fontWeight: 700, marginTop: 10, marginBottom: 4 },
  board: { borderTopWidth: 0.75, borderTopColor: LINE, paddingTop: 6, marginTop: 6 },
  row: { flexDirection: 'row', marginBottom: 3 },
  label: { width: 150, fontWeight: 700 },
  value: { flex: 1 },
  step: { color: SOFT, fontSize: 8 },
  footer: { position: 'absolute', left: 36, right: 36, bottom: 20, flexDirection: 'row', fontSize: 6.5, color: INK },
  caution: { flex: 1, paddingRight: 12 },
});

/** An A4 page's width inside the page's padding, in points (the drawing is scaled to it). */
const CONTENT_WIDTH_PT = 595.28 - 2 * 36;
/** The height left for the drawing on a page, in points: A4 less the padding, the title and a two-line subtitle. */
const DRAWING_HEIGHT_PT = 640;

/**
 * The drawing's height that fits on one page, in viewBox units: the drawing is scaled to the
 * page's width, so a narrow drawing (a shallow tree) is scaled up and fewer of its rows fit.
 */
export function pageDrawingHeight(layoutWidth: number): number {
  return (DRAWING_HEIGHT_PT * layoutWidth) / CONTENT_WIDTH_PT;
}

/** Split the laid-out boards into pages of whole rows (a board and the sub-main above it), each at most `pageHeight` tall. */
export function diagramPages(
  boards: readonly PlacedBoard[],
  pageHeight: number,
): Array<{ top: number; bottom: number; boards: PlacedBoard[] }> {
  const pages: Array<{ top: number; bottom: number; boards: PlacedBoard[] }> = [];
  let current = { top: 0, bottom: DIAGRAM.margin + DIAGRAM.originHeight, boards: [] as PlacedBoard[] };
  for (const p of boards) {
    const rowTop = p.y - DIAGRAM.feedHeight;
    const rowBottom = p.y + DIAGRAM.boxHeight;
    if (rowBottom - current.top > pageHeight && current.boards.length > 0) {
      pages.push(current);
      current = { top: rowTop, bottom: rowBottom, boards: [] };
    }
    current.boards.push(p);
    current.bottom = rowBottom;
  }
  pages.push(current);
  return pages;
}

const n = (x: number, d: number) => x.toFixed(d);

function BoardDrawing({ p, name }: { p: PlacedBoard; name: string }) {
  const { board: b, x, y, stemX, stemTopY } = p;
  const { boxWidth: w, boxHeight: h, feedHeight } = DIAGRAM;
  const values = [b.zdb ? `Zdb ${n(b.zdb.value, 3)} Ω` : null, b.pfc ? `PFC ${n(b.pfc.value, 2)} kA` : null]
    .filter(Boolean)
    .join(' · ');
  const second = [
    b.vdUsed ? `Volt drop used ${n(b.vdUsed.value, 2)} %` : null,
    b.sizing ? `Demand ${n(b.sizing.summary.maxDemandA, 1)} A` : null,
  ]
    .filter(Boolean)
    .join(' · ');
  const kind = b.fedFrom?.device ?? '';
  return (
    <G>
      <Path d={`M ${stemX} ${stemTopY} V ${y + 22} H ${x}`} stroke={SOFT} strokeWidth={1.2} fill="none" />
      {b.fedFrom ? (
        <G>
          {kind.includes('fuse') ? (
            // IEC 60617 fuse: a rectangle with the conductor through it.
            <Rect
              x={stemX - 5}
              y={y - feedHeight + 8}
              width={10}
              height={22}
              stroke={INK}
              strokeWidth={1.2}
              fill="#ffffff"
            />
          ) : kind.startsWith('MCB') || kind.startsWith('RCBO') ? (
            // IEC 60617 circuit-breaker: a make contact with a cross at its fixed end.
            <G>
              <Rect x={stemX - 12} y={y - feedHeight + 12} width={16} height={18} fill="#ffffff" />
              <Line
                x1={stemX - 4}
                y1={y - feedHeight + 8}
                x2={stemX + 4}
                y2={y - feedHeight + 16}
                stroke={INK}
                strokeWidth={1.2}
              />
              <Line
                x1={stemX + 4}
                y1={y - feedHeight + 8}
                x2={stemX - 4}
                y2={y - feedHeight + 16}
                stroke={INK}
                strokeWidth={1.2}
              />
              <Line
                x1={stemX}
                y1={y - feedHeight + 30}
                x2={stemX - 10}
                y2={y - feedHeight + 13}
                stroke={INK}
                strokeWidth={1.2}
              />
            </G>
          ) : null}
          <Text x={x} y={y - feedHeight + 18} style={{ fontFamily: PRINT_FONT, fontSize: 10 }} fill={INK}>
            {`${b.fedFrom.device}${b.fedFrom.wayLabel ? ` (way ${b.fedFrom.wayLabel})` : ''}${b.phase ? `, ${b.phase}` : ''}`}
          </Text>
          <Text x={x} y={y - feedHeight + 32} style={{ fontFamily: PRINT_FONT, fontSize: 9 }} fill={SOFT}>
            {b.fedFrom.cable}
          </Text>
        </G>
      ) : null}
      <Rect x={x} y={y} width={w} height={h} rx={6} stroke={LINE} strokeWidth={1.2} fill="#ffffff" />
      <Text x={x + 10} y={y + 20} style={{ fontFamily: PRINT_FONT, fontSize: 12, fontWeight: 700 }} fill={INK}>
        {name}
      </Text>
      <Text x={x + 10} y={y + 40} style={{ fontFamily: PRINT_FONT, fontSize: 10 }} fill={INK}>
        {b.problem ? 'No carried values: see the sub-main above' : values}
      </Text>
      <Text x={x + 10} y={y + 58} style={{ fontFamily: PRINT_FONT, fontSize: 10 }} fill={SOFT}>
        {second}
      </Text>
      <Text
        x={x + 10}
        y={y + 78}
        style={{ fontFamily: PRINT_FONT, fontSize: 10, fontWeight: 700 }}
        fill={b.worstVerdict ? VERDICT_INK[b.worstVerdict] : SOFT}
      >
        {b.worstVerdict ? `Worst verdict: ${VERDICT_WORDS[b.worstVerdict]}` : 'Not sized'}
      </Text>
    </G>
  );
}

function WorkingLines({ label, value, working }: { label: string; value: string; working: Working }) {
  return (
    <View style={styles.row} wrap={false}>
      <Text style={styles.label}>{label}</Text>
      <View style={styles.value}>
        <Text>{`${value}. ${working.text}`}</Text>
        {working.steps.map((s, i) => (
          <Text key={i} style={styles.step}>
            {s}
          </Text>
        ))}
        <Text style={styles.step}>{`Basis: ${working.sources.join('; ')}`}</Text>
      </View>
    </View>
  );
}

function BoardValues({ b }: { b: SiteBoardResult }) {
  const lines = [
    b.zdb ? (
      <WorkingLines label="Earth fault loop impedance" value={`${n(b.zdb.value, 3)} Ω`} working={b.zdb.working} />
    ) : null,
    b.pfc ? (
      <WorkingLines label="Prospective fault current" value={`${n(b.pfc.value, 2)} kA`} working={b.pfc.working} />
    ) : null,
    b.vdUsed ? (
      <WorkingLines label="Volt drop used above" value={`${n(b.vdUsed.value, 2)} %`} working={b.vdUsed.working} />
    ) : null,
    b.subMainCurrent ? (
      <WorkingLines
        label="Sub-main design current"
        value={`${n(b.subMainCurrent.value, 1)} A`}
        working={b.subMainCurrent.working}
      />
    ) : null,
    ...groupSelectivity(b.selectivity).map((g, i) => (
      <WorkingLines
        key={`selectivity-${i}`}
        label={i === 0 ? 'Selectivity (advisory)' : ''}
        value={`${g.upstream} above ${g.device}${g.places.length ? ` (${placesWords(g.places)})` : ''}: ${selectivityWords(g.outcome, g.upToA)}`}
        working={g.working}
      />
    )),
  ].filter((line) => line !== null);
  return (
    <View style={styles.board}>
      {/* The board's name is never alone at the foot of a page: its first value stays with it */}
      <View wrap={false}>
        <Text
          style={{ fontFamily: PRINT_FONT, fontSize: 10, fontWeight: 700, marginBottom: 3 }}
        >{`${b.name}, fed from ${fedFromWords(b.fedFrom)}${b.phase ? ` (${b.phase})` : ''}`}</Text>
        {b.problem ? <Text>{b.problem}</Text> : null}
        {lines[0] ?? null}
      </View>
      {lines.slice(1).map((line, i) => (
        <Fragment key={i}>{line}</Fragment>
      ))}
    </View>
  );
}

function Footer({ caution, siteName }: { caution: string; siteName: string }) {
  return (
    <View style={styles.footer} fixed>
      <Text style={styles.caution}>{`Caution. ${caution}`}</Text>
      <Text
        style={{ width: 150, textAlign: 'right' }}
        render={({ pageNumber, totalPages }) => `${siteName} · page ${pageNumber} of ${totalPages}`}
      />
    </View>
  );
}

/**
 * The site pack's own pages: the single-line diagram (drawn with react-pdf's SVG primitives
 * from the same layout as the screen's diagram), then every board's carried values with their
 * working. The design-aid caution is on every page.
 */
export function SitePackDocument({
  site,
  siteName,
  printedOn,
  caution,
  boxNames,
}: {
  site: SiteResult;
  siteName: string;
  printedOn: string;
  caution: string;
  /** Each board's name cut to its box in the drawing (`diagramBoxNames`), by board id. */
  boxNames: ReadonlyMap<string, string>;
}) {
  const layout = layoutSite(site);
  const pages = diagramPages(layout.boards, pageDrawingHeight(layout.width));
  const o = site.origin;
  const originWords = `${EARTHING_NAMES[o.earthing] ?? o.earthing}, Uo ${o.uoV} V, ${SUPPLY_SOURCE_NAMES[o.source].toLowerCase()}; Ze ${n(o.zeOhm, 3)} Ω, prospective fault current ${n(o.pfcKa, 2)} kA`;
  return (
    <Document title={`Site pack: ${siteName}`} creator="Boardwright">
      {pages.map((pg, i) => (
        <Page key={i} size="A4" style={styles.page}>
          {i === 0 ? (
            <View>
              <Text style={styles.title}>{`Site pack: ${siteName}`}</Text>
              <Text
                style={styles.subtitle}
              >{`Single-line diagram, printed ${printedOn}. Origin: ${originWords}.`}</Text>
            </View>
          ) : (
            <Text style={styles.subtitle}>{`Single-line diagram of ${siteName}, continued`}</Text>
          )}
          {/* Sized in points (the page's width, the height in proportion): a drawing sized by its
              box alone collapses when it does not fit the page */}
          <Svg
            viewBox={`0 ${pg.top} ${layout.width} ${pg.bottom - pg.top + 4}`}
            style={{
              width: CONTENT_WIDTH_PT,
              height: ((pg.bottom - pg.top + 4) * CONTENT_WIDTH_PT) / layout.width,
            }}
          >
            {i === 0 ? (
              <G>
                <Rect
                  x={DIAGRAM.margin}
                  y={DIAGRAM.margin}
                  width={DIAGRAM.boxWidth}
                  height={DIAGRAM.originHeight - 18}
                  rx={6}
                  stroke={LINE}
                  strokeWidth={1.2}
                  fill="#efece4"
                />
                <Text
                  x={DIAGRAM.margin + 10}
                  y={DIAGRAM.margin + 20}
                  style={{ fontFamily: PRINT_FONT, fontSize: 12, fontWeight: 700 }}
                  fill={INK}
                >
                  Origin (supply intake)
                </Text>
                <Text
                  x={DIAGRAM.margin + 10}
                  y={DIAGRAM.margin + 38}
                  style={{ fontFamily: PRINT_FONT, fontSize: 9 }}
                  fill={SOFT}
                >
                  {`${EARTHING_NAMES[o.earthing] ?? o.earthing}, Uo ${o.uoV} V, Ze ${n(o.zeOhm, 3)} Ω, PFC ${n(o.pfcKa, 2)} kA`}
                </Text>
              </G>
            ) : null}
            {pg.boards.map((p) => (
              <BoardDrawing key={p.board.boardId} p={p} name={boxNames.get(p.board.boardId) ?? p.board.name} />
            ))}
          </Svg>
          <Footer caution={caution} siteName={siteName} />
        </Page>
      ))}
      <Page size="A4" style={styles.page}>
        <Text style={styles.heading}>Values carried to each board, with their working</Text>
        {site.boards.map((b) => (
          <BoardValues key={b.boardId} b={b} />
        ))}
        <Footer caution={caution} siteName={siteName} />
      </Page>
    </Document>
  );
}
