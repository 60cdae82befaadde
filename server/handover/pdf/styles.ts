import { StyleSheet } from '@react-pdf/renderer';
import { MONO, SANS } from './fonts';

/** Wardbook's palette (product.md, "Look and feel"); state colours are used only for state. */
export const colours = {
  ink: '#14213D',
  brass: '#B7873A',
  paper: '#F8F6F1',
  white: '#FFFFFF',
  hairline: '#D9D4C7',
  muted: '#5B6475',
  normal: '#2E7D5B',
  alarm: '#C8391F',
  fault: '#B97A00',
  info: '#4A5B73',
  /** The loop gauge's track: where a reading falls outside every band. */
  track: '#ECE8DE',
} as const;

export const PAGE_MARGIN = 40;

export const styles = StyleSheet.create({
  // No lineHeight here: set on the page it stops react-pdf drawing render-prop text
  // ("Page N of M"). Plex's own line spacing (1.3 em) is used instead.
  page: {
    fontFamily: SANS,
    fontSize: 9,
    color: colours.ink,
    backgroundColor: colours.white,
    paddingTop: 46,
    paddingBottom: 58,
    paddingHorizontal: PAGE_MARGIN,
  },
  mono: { fontFamily: MONO },
  muted: { color: colours.muted },
  small: { fontSize: 7.5 },
  bold: { fontWeight: 600 },

  // Headings: a brass rule over an ink title, the pack's one piece of ornament.
  sectionHeading: {
    borderTopWidth: 2,
    borderTopColor: colours.brass,
    paddingTop: 6,
    marginBottom: 10,
  },
  sectionKicker: {
    fontSize: 7.5,
    fontWeight: 600,
    letterSpacing: 0.4,
    textTransform: 'uppercase',
    color: colours.brass,
  },
  sectionTitle: { fontSize: 17, lineHeight: 1.2, fontWeight: 600, color: colours.ink },
  subheading: { fontSize: 11, lineHeight: 1.3, fontWeight: 600, marginTop: 12, marginBottom: 5 },
  paragraph: { marginBottom: 5 },

  card: {
    borderWidth: 0.75,
    borderColor: colours.hairline,
    borderRadius: 3,
    padding: 9,
    backgroundColor: colours.white,
  },
  panel: {
    borderRadius: 3,
    padding: 9,
    backgroundColor: colours.paper,
  },
  label: {
    fontSize: 7,
    fontWeight: 600,
    letterSpacing: 0.6,
    textTransform: 'uppercase',
    color: colours.muted,
    marginBottom: 1.5,
  },

  // Key/value lists.
  fieldRow: { flexDirection: 'row', marginBottom: 3 },
  fieldName: { width: 140, color: colours.muted },
  fieldValue: { flex: 1 },

  bulletRow: { flexDirection: 'row', marginBottom: 3 },
  bullet: { width: 10, color: colours.brass },
  bulletText: { flex: 1 },

  // Tables.
  table: { borderTopWidth: 0.75, borderTopColor: colours.ink, marginBottom: 6 },
  tableHeader: {
    flexDirection: 'row',
    backgroundColor: colours.paper,
    borderBottomWidth: 0.75,
    borderBottomColor: colours.ink,
  },
  tableHeaderCell: {
    fontSize: 7,
    fontWeight: 600,
    color: colours.ink,
    paddingVertical: 3.5,
    paddingHorizontal: 3,
  },
  tableRow: { borderBottomWidth: 0.5, borderBottomColor: colours.hairline },
  tableCells: { flexDirection: 'row' },
  tableCell: { paddingVertical: 3.5, paddingHorizontal: 3, fontSize: 8 },

  // The fixed furniture on every page.
  footer: {
    position: 'absolute',
    bottom: 22,
    left: PAGE_MARGIN,
    right: PAGE_MARGIN,
    flexDirection: 'row',
    justifyContent: 'space-between',
    alignItems: 'flex-end',
    borderTopWidth: 0.5,
    borderTopColor: colours.hairline,
    paddingTop: 5,
    fontSize: 7.5,
    color: colours.muted,
  },
  previewBanner: {
    position: 'absolute',
    top: 14,
    left: PAGE_MARGIN,
    right: PAGE_MARGIN,
    paddingVertical: 3,
    borderWidth: 1,
    borderColor: colours.fault,
    color: colours.fault,
    backgroundColor: '#FFF8E8',
    fontSize: 8.5,
    fontWeight: 700,
    textAlign: 'center',
    letterSpacing: 0.5,
  },
  previewWatermark: {
    position: 'absolute',
    top: '42%',
    left: 0,
    right: 0,
    textAlign: 'center',
    fontSize: 64,
    lineHeight: 1.1,
    fontWeight: 700,
    color: colours.fault,
    opacity: 0.09,
    transform: 'rotate(-30deg)',
  },
});

/** Colour and word for a pass, a fail, or nothing recorded — never colour alone. */
export function verdict(passed: boolean | null): { word: string; colour: string } {
  if (passed === true) return { word: 'PASS', colour: colours.normal };
  if (passed === false) return { word: 'FAIL', colour: colours.alarm };
  return { word: 'NOT RECORDED', colour: colours.fault };
}
