import { Document, Page, StyleSheet, Text, View } from '@react-pdf/renderer';

import { JOIN_MARK_MM, LABEL, MM, MODULE_PITCH_MM, shortenedLabels, type LabelSheet } from '../utils/build-labels';
import { PRINT_FONT } from '../utils/fonts';
import { PRINT_INK } from '../utils/print-palette';

const styles = StyleSheet.create({
  page: { fontFamily: PRINT_FONT, color: PRINT_INK, padding: 10 * MM, fontSize: 7 },
  title: { fontSize: 11, fontWeight: 700 },
  meta: { fontSize: 7.5, color: '#4b5563', marginTop: 2 },
  scale: { flexDirection: 'row', alignItems: 'center', marginTop: 5, marginBottom: 6 },
  scaleBar: { width: 50 * MM, height: 4, backgroundColor: '#1f2a37', marginRight: 6 },
  railTitle: { fontSize: 8, fontWeight: 700, marginTop: 8, marginBottom: 3 },
  strip: { flexDirection: 'row', marginBottom: 5 },
  // The text between the number and the device is fitted to this box beforehand (`fitLabelTexts`)
  cell: {
    height: LABEL.heightMm * MM,
    borderWidth: LABEL.border,
    borderStyle: 'dashed',
    borderColor: '#6b7580',
    paddingHorizontal: LABEL.padX,
    paddingVertical: LABEL.padY,
    justifyContent: 'space-between',
  },
  ref: { fontSize: LABEL.refSize, fontWeight: 700, textAlign: 'center' },
  text: { textAlign: 'center' },
  device: { fontSize: LABEL.deviceSize, textAlign: 'center', color: '#4b5563' },
  draft: { color: '#b3261e', fontWeight: 700, fontSize: 8, marginTop: 3 },
  shortened: { marginTop: 8, fontSize: 7 },
  shortenedTitle: { fontSize: 8, fontWeight: 700, marginBottom: 2 },
  join: {
    width: JOIN_MARK_MM * MM,
    height: LABEL.heightMm * MM,
    backgroundColor: '#f3e2d3',
    justifyContent: 'center',
    alignItems: 'center',
  },
  joinBefore: { borderRightWidth: 1.2, borderRightColor: '#b5652b' },
  joinAfter: { borderLeftWidth: 1.2, borderLeftColor: '#b5652b' },
  joinText: { fontSize: 6, fontWeight: 700, color: '#8f4c1c' },
  joinGap: { width: JOIN_MARK_MM * MM },
});

/** Way labels drawn to the module pitch, strip by strip in rail order, with cut lines. */
export function LabelStripsDocument({ sheet }: { sheet: LabelSheet }) {
  const shortened = shortenedLabels(sheet);
  return (
    <Document
      title={`Labels: ${sheet.boardName}, revision ${sheet.revision}`}
      creator="Boardwright"
      producer="Boardwright"
    >
      <Page size="A4" orientation="landscape" style={styles.page}>
        <Text style={styles.title}>Way labels: {sheet.boardName}</Text>
        <Text style={styles.meta}>
          {sheet.siteName} · revision {sheet.revision} · {MODULE_PITCH_MM} mm per module · cut along the dashed lines
        </Text>
        <Text style={styles.meta}>
          Each rail is one strip. A rail too long for the page is printed in pieces that meet at a marked join: cut off
          the shaded join marks along the solid line and butt the two ends together, J1 to J1.
        </Text>
        {sheet.draft ? <Text style={styles.draft}>Draft, not issued: do not fit these labels.</Text> : null}
        <View style={styles.scale}>
          <View style={styles.scaleBar} />
          <Text>Print at actual size (100 %): this bar must measure 50 mm.</Text>
        </View>
        {sheet.rails.map((rail) => (
          <View key={rail.rail}>
            <Text style={styles.railTitle}>
              Rail {rail.rail + 1} ({rail.modules} modules
              {rail.strips.length > 1
                ? `: one strip in ${rail.strips.length} pieces, joined at ${rail.strips.flatMap((x) => (x.joinAfter ? [x.joinAfter] : [])).join(', ')}`
                : ''}
              )
            </Text>
            {rail.strips.map((strip) => (
              <View key={strip.firstModule} style={styles.strip} wrap={false}>
                {strip.joinBefore ? (
                  <View style={[styles.join, styles.joinBefore]}>
                    <Text style={styles.joinText}>{strip.joinBefore}</Text>
                  </View>
                ) : (
                  <View style={styles.joinGap} />
                )}
                {strip.cells.map((cell) => (
                  <View key={cell.wayId} style={[styles.cell, { width: cell.modules * MODULE_PITCH_MM * MM }]}>
                    <Text style={styles.ref}>{cell.ref ?? ' '}</Text>
                    <Text style={[styles.text, { fontSize: cell.textSize }]}>{cell.text}</Text>
                    <Text style={styles.device}>{cell.device}</Text>
                  </View>
                ))}
                {strip.joinAfter ? (
                  <View style={[styles.join, styles.joinAfter]}>
                    <Text style={styles.joinText}>{strip.joinAfter}</Text>
                  </View>
                ) : null}
              </View>
            ))}
          </View>
        ))}
        {shortened.length ? (
          <View style={styles.shortened}>
            <Text style={styles.shortenedTitle}>
              Labels shortened to fit: their whole text, as the schedule gives it
            </Text>
            {shortened.map((l, i) => (
              <Text key={i}>
                {l.name}: {l.whole}
              </Text>
            ))}
          </View>
        ) : null}
      </Page>
    </Document>
  );
}
