import { StyleSheet } from '@react-pdf/renderer';
import { FONT_WEIGHTS, PROPOSAL_FONT } from './fonts';

/**
 * The proposal's look: the app's own palette (deep slate-teal ink, warm paper greys, amber for what needs
 * care), US Letter with 0.7 in margins, 10 pt body. Points throughout.
 */
export const COLORS = {
  ink: '#12343b',
  inkSoft: '#3a6f75',
  inkWash: '#f2f7f7',
  inkLine: '#b6d4d5',
  text: '#1d2321',
  muted: '#5f6663',
  line: '#dedbd3',
  amberWash: '#fdf1dc',
  amberLine: '#eec27a',
  amberDeep: '#8a5407',
} as const;

export const MARGIN = 50;

export const s = StyleSheet.create({
  page: {
    fontFamily: PROPOSAL_FONT,
    fontSize: 10,
    lineHeight: 1.35,
    color: COLORS.text,
    paddingTop: MARGIN + 16,
    paddingBottom: MARGIN + 8,
    paddingHorizontal: MARGIN,
  },
  header: {
    position: 'absolute',
    top: 28,
    left: MARGIN,
    right: MARGIN,
    flexDirection: 'row',
    justifyContent: 'space-between',
    fontSize: 8.5,
    color: COLORS.muted,
    borderBottomWidth: 0.75,
    borderBottomColor: COLORS.inkLine,
    paddingBottom: 4,
  },
  footer: {
    position: 'absolute',
    bottom: 26,
    left: MARGIN,
    right: MARGIN,
    flexDirection: 'row',
    justifyContent: 'space-between',
    fontSize: 8.5,
    color: COLORS.muted,
  },
  h1: { fontSize: 18, fontWeight: FONT_WEIGHTS.bold, color: COLORS.ink, marginBottom: 4, lineHeight: 1.2 },
  h2: {
    fontSize: 12.5,
    fontWeight: FONT_WEIGHTS.bold,
    color: COLORS.ink,
    marginTop: 14,
    marginBottom: 5,
    lineHeight: 1.2,
  },
  h3: { fontSize: 10.5, fontWeight: FONT_WEIGHTS.semibold, color: COLORS.ink, marginTop: 8, marginBottom: 3 },
  lead: { fontSize: 10.5, color: COLORS.muted, marginBottom: 8 },
  p: { marginBottom: 5 },
  small: { fontSize: 8.5, color: COLORS.muted },
  strong: { fontWeight: FONT_WEIGHTS.semibold },
  bold: { fontWeight: FONT_WEIGHTS.bold },
  note: {
    backgroundColor: COLORS.inkWash,
    borderLeftWidth: 3,
    borderLeftColor: COLORS.inkSoft,
    padding: 8,
    marginVertical: 6,
  },
  caution: {
    backgroundColor: COLORS.amberWash,
    borderLeftWidth: 3,
    borderLeftColor: COLORS.amberLine,
    padding: 8,
    marginVertical: 6,
  },
  cautionTitle: { fontWeight: FONT_WEIGHTS.bold, color: COLORS.amberDeep, marginBottom: 2 },
  table: { borderTopWidth: 0.75, borderTopColor: COLORS.ink, marginVertical: 4 },
  tr: {
    flexDirection: 'row',
    borderBottomWidth: 0.5,
    borderBottomColor: COLORS.line,
    paddingVertical: 3.5,
  },
  th: { fontSize: 8.5, fontWeight: FONT_WEIGHTS.semibold, color: COLORS.muted },
  totalRow: { borderBottomWidth: 0.75, borderBottomColor: COLORS.ink, fontWeight: FONT_WEIGHTS.bold },
  // Long-hand paddings: react-pdf expands a shorthand after merging, which would undo firstCell/lastCell.
  cell: { paddingLeft: 5, paddingRight: 5 },
  firstCell: { paddingLeft: 0 },
  lastCell: { paddingRight: 0 },
  num: { textAlign: 'right' },
  bullet: { flexDirection: 'row', marginBottom: 2.5 },
  bulletMark: { width: 12, color: COLORS.inkSoft },
  bulletText: { flex: 1 },
});
