import { Document, Image, Page, StyleSheet, Text, View } from '@react-pdf/renderer';

import { PRINT_FONT } from '../utils/fonts';
import {
  PRINT_COPPER as COPPER,
  PRINT_FAINT as FAINT,
  PRINT_INK as INK,
  PRINT_SOFT as SOFT,
  VERDICT_TONES as TONES,
} from '../utils/print-palette';
import type { ScheduleRow } from '../types/schedule-table';
import type { ScheduleData, ScheduleFact } from '../utils/build-schedule';
import { HEADER, type FittedHeader } from '../utils/fit-header';
import { PAGE, pageGroupHeading, scaledColumns, type SchedulePage } from '../utils/paginate-schedule';

const LINE = '#dcd7cc';

const styles = StyleSheet.create({
  page: {
    fontFamily: PRINT_FONT,
    fontSize: PAGE.fontSize,
    color: INK,
    paddingTop: PAGE.marginTop,
    paddingHorizontal: PAGE.marginX,
    paddingBottom: PAGE.marginBottom,
  },
  header: {
    height: PAGE.headerHeight - 4,
    flexDirection: 'row',
    borderBottomWidth: 1.5,
    borderBottomColor: INK,
    paddingBottom: 6,
    marginBottom: 4,
  },
  // The header's texts are fitted to these boxes beforehand (utils/fit-header.ts)
  brand: { width: HEADER.brandWidth, paddingRight: HEADER.brandPadRight },
  org: { fontSize: HEADER.orgSize, color: SOFT, textTransform: 'uppercase', letterSpacing: 0.6 },
  title: { fontSize: HEADER.titleSize, color: COPPER, fontWeight: 700, marginTop: HEADER.titleGap },
  boardName: { fontWeight: 700, marginTop: HEADER.nameGap },
  place: { fontSize: HEADER.placeSize, color: SOFT, marginTop: HEADER.placeGap },
  facts: { flex: 1, paddingHorizontal: HEADER.factsPadX, borderLeftWidth: 0.5, borderLeftColor: LINE },
  // Eight rows (a fed board's supply) of 8.2 pt lines fit the header's 74 pt with 1 pt between
  factRow: { flexDirection: 'row', marginBottom: HEADER.factGap },
  factLabel: { width: HEADER.factLabelWidth, color: SOFT },
  factValue: { flex: 1, fontWeight: 700 },
  qr: { width: 58, height: 58, marginLeft: 6 },
  qrCaption: { fontSize: 5.5, color: FAINT, textAlign: 'center', width: 58, marginLeft: 6, marginTop: 1 },
  draftBanner: {
    marginBottom: 3,
    backgroundColor: '#fbe4e1',
    color: TONES.fails,
    fontWeight: 700,
    fontSize: 8,
    paddingVertical: 2,
    paddingHorizontal: 6,
  },
  headRow: {
    flexDirection: 'row',
    backgroundColor: INK,
    color: '#ffffff',
    fontWeight: 700,
    alignItems: 'flex-end',
    height: PAGE.headRowHeight,
  },
  cell: { paddingHorizontal: 2.5, paddingVertical: 2.2 },
  group: {
    height: PAGE.groupHeight - 2,
    flexDirection: 'row',
    backgroundColor: '#f3e2d3',
    borderBottomWidth: 0.5,
    borderBottomColor: COPPER,
    paddingVertical: 2,
    paddingHorizontal: 3,
    marginTop: 2,
  },
  groupText: { fontWeight: 700, fontSize: 7, color: '#8f4c1c' },
  row: { flexDirection: 'row', borderBottomWidth: 0.4, borderBottomColor: LINE },
  rowAlt: { backgroundColor: '#f7f5f0' },
  spare: { color: FAINT },
  wayRef: { fontWeight: 700, fontSize: 7.5 },
  sectionTitle: { fontSize: 8.5, fontWeight: 700, marginBottom: 3, color: INK },
  lower: { flexDirection: 'row', marginTop: 8 },
  totals: { width: 300, paddingRight: 12 },
  notices: { flex: 1 },
  notice: {
    borderLeftWidth: 2,
    borderLeftColor: COPPER,
    paddingLeft: 5,
    marginBottom: 4,
  },
  noticeTitle: { fontWeight: 700, fontSize: 7.5 },
  noteLine: { fontSize: 6.5, color: TONES.fails, marginBottom: 1 },
  designValues: { height: PAGE.designValuesHeight - 2, marginBottom: 2, fontSize: 6.5, color: SOFT },
  noticesNote: { fontSize: 6.5, color: SOFT, marginTop: 1 },
  footer: {
    position: 'absolute',
    left: PAGE.marginX,
    right: PAGE.marginX,
    bottom: 12,
    borderTopWidth: 0.5,
    borderTopColor: LINE,
    paddingTop: 4,
    flexDirection: 'row',
  },
  caution: { flex: 1, fontSize: 6.5, color: INK, paddingRight: 12 },
  pageNo: { width: HEADER.footerWidth, fontSize: HEADER.footerSize, color: SOFT, textAlign: 'right' },
});

function Facts({ facts, labelWidth = 50 }: { facts: ScheduleFact[]; labelWidth?: number }) {
  return (
    <View>
      {facts.map((f) => (
        <View key={f.label} style={styles.factRow}>
          <Text style={[styles.factLabel, { width: labelWidth }]}>{f.label}</Text>
          <Text style={styles.factValue}>{f.value}</Text>
        </View>
      ))}
    </View>
  );
}

type Column = ReturnType<typeof scaledColumns>[number];

function Row({ row, columns, index }: { row: ScheduleRow; columns: Column[]; index: number }) {
  return (
    <View style={[styles.row, index % 2 === 1 ? styles.rowAlt : {}]}>
      {columns.map((col) => {
        const tone =
          col.key === 'result' && row.verdict
            ? { color: TONES[row.verdict], fontWeight: 700 as const }
            : col.key === 'label' && (row.label === 'wrong' || row.label === 'missing')
              ? { color: TONES.fails, fontWeight: 700 as const }
              : col.key === 'label' && row.label === 'matches'
                ? { color: TONES.passes }
                : {};
        return (
          <Text
            key={col.key}
            style={[
              styles.cell,
              { width: col.pt, textAlign: col.align },
              col.key === 'way' ? styles.wayRef : {},
              row.spare && col.key !== 'way' ? styles.spare : {},
              tone,
            ]}
          >
            {row.cells[col.key]}
          </Text>
        );
      })}
    </View>
  );
}

function Header({ data, header, qrDataUrl }: { data: ScheduleData; header: FittedHeader; qrDataUrl: string }) {
  return (
    <View style={styles.header}>
      <View style={styles.brand}>
        <Text style={styles.org}>{data.organisationName}</Text>
        <Text style={styles.title}>Board schedule</Text>
        <Text style={[styles.boardName, { fontSize: header.boardNameSize }]}>{header.boardName}</Text>
        <Text style={styles.place}>{header.place}</Text>
      </View>
      <View style={styles.facts}>
        <Facts facts={header.supply} />
      </View>
      <View style={styles.facts}>
        <Facts facts={header.document} />
      </View>
      <View>
        {/* react-pdf's Image has no alt text; the caption below says what the code is */}
        {/* eslint-disable-next-line jsx-a11y/alt-text */}
        <Image style={styles.qr} src={qrDataUrl} />
        <Text style={styles.qrCaption}>Scan for the live board</Text>
      </View>
    </View>
  );
}

function Summary({ data }: { data: ScheduleData }) {
  return (
    <View style={styles.lower}>
      <View style={styles.totals}>
        <Text style={styles.sectionTitle}>Totals</Text>
        <Facts facts={data.totals} labelWidth={120} />
      </View>
      <View style={styles.notices}>
        <Text style={styles.sectionTitle}>Notices for this board</Text>
        {data.notices.map((n) => (
          <View key={n.title} style={styles.notice}>
            <Text style={styles.noticeTitle}>{n.title}</Text>
            <Text>{n.text}</Text>
          </View>
        ))}
        <Text style={styles.noticesNote}>{data.noticesNote}</Text>
      </View>
    </View>
  );
}

/**
 * The printed board schedule: A4 landscape, pages laid out by `paginateSchedule`, each with
 * the header, the column headings, the group it continues and the caution.
 */
export function ScheduleDocument({
  data,
  header,
  qrDataUrl,
  pages,
}: {
  data: ScheduleData;
  /** The header's and footer's texts fitted to their boxes (`fitScheduleHeader`). */
  header: FittedHeader;
  qrDataUrl: string;
  pages: SchedulePage[];
}) {
  const columns = scaledColumns(data.columns);
  return (
    <Document
      title={`Board schedule: ${data.boardName}, revision ${data.revision}`}
      author={data.organisationName}
      subject={`${data.siteName}: ${data.boardName}`}
      creator="Boardwright"
      producer="Boardwright"
    >
      {pages.map((page, p) => (
        <Page key={p} size="A4" orientation="landscape" style={styles.page} wrap={false}>
          <Header data={data} header={header} qrDataUrl={qrDataUrl} />
          {data.draft ? (
            <Text style={styles.draftBanner}>
              Draft, revision {data.revision}: not issued. Do not build or label a board from this print.
            </Text>
          ) : null}
          <Text style={styles.designValues}>{data.designValuesNote}</Text>
          {page.items.length ? (
            <View style={styles.headRow}>
              {columns.map((col) => (
                <Text key={col.key} style={[styles.cell, { width: col.pt, textAlign: col.align }]}>
                  {col.heading}
                </Text>
              ))}
            </View>
          ) : null}
          {page.items.map((item, i) =>
            item.kind === 'group' ? (
              <View key={`g${i}`} style={styles.group}>
                <Text style={styles.groupText}>{pageGroupHeading(item)}</Text>
              </View>
            ) : (
              <Row key={item.row.wayId} row={item.row} columns={columns} index={item.index} />
            ),
          )}
          {page.summary ? <Summary data={data} /> : null}
          {page.notes.length ? (
            <View style={{ marginTop: 6 }}>
              <Text style={styles.sectionTitle}>Checks not met in the design</Text>
              {page.notes.map((line, i) => (
                <Text key={i} style={styles.noteLine}>
                  {line}
                </Text>
              ))}
            </View>
          ) : null}
          <View style={styles.footer}>
            <Text style={styles.caution}>Caution. {data.caution}</Text>
            <Text style={styles.pageNo}>
              {header.footerName} · revision {data.revision} · page {p + 1} of {pages.length}
            </Text>
          </View>
        </Page>
      ))}
    </Document>
  );
}
