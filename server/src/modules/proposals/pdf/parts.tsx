import type { ReactNode } from 'react';
import { Page, Text, View, type Styles } from '@react-pdf/renderer';
import { paragraphs } from './format';
import { s } from './styles';

/** What every page prints in its margins. All strings already made printable. */
export interface PageFrameText {
  readonly company: string;
  readonly title: string;
  readonly issued: string;
}

/** A Letter page with the proposal's running header and footer ("Page 2 of 9"). */
export function ProposalPage({
  frame,
  children,
  bookmark,
}: {
  frame: PageFrameText;
  children: ReactNode;
  bookmark?: string;
}) {
  return (
    <Page size="LETTER" style={s.page} bookmark={bookmark}>
      <View style={s.header} fixed>
        <Text>{frame.company}</Text>
        <Text>{frame.title}</Text>
      </View>
      {children}
      <View style={s.footer} fixed>
        <Text>{frame.issued}</Text>
        <Text render={({ pageNumber, totalPages }) => `Page ${pageNumber} of ${totalPages}`} />
      </View>
    </Page>
  );
}

export interface Column {
  readonly label: string;
  /** Share of the width (flex-grow). */
  readonly flex: number;
  readonly numeric?: boolean;
}

/**
 * A table: a header row repeated on each page it runs onto, rows never split across pages. Cells are
 * printable strings; `total` rows print bold with a rule under them.
 */
export function Table({
  columns,
  rows,
}: {
  columns: readonly Column[];
  rows: readonly { cells: readonly string[]; total?: boolean; key: string }[];
}) {
  const last = columns.length - 1;
  const cellStyle = (c: Column, i: number): Styles[string][] => [
    s.cell,
    { flex: c.flex },
    ...(i === 0 ? [s.firstCell] : []),
    ...(i === last ? [s.lastCell] : []),
    ...(c.numeric ? [s.num] : []),
  ];
  return (
    <View style={s.table}>
      <View style={s.tr} fixed>
        {columns.map((c, i) => (
          <Text key={c.label} style={[...cellStyle(c, i), s.th]}>
            {c.label}
          </Text>
        ))}
      </View>
      {rows.map((r) => (
        <View key={r.key} style={r.total ? [s.tr, s.totalRow] : s.tr} wrap={false}>
          {columns.map((c, i) => (
            <Text key={c.label} style={cellStyle(c, i)}>
              {r.cells[i] ?? ''}
            </Text>
          ))}
        </View>
      ))}
    </View>
  );
}

/** Label–value pairs in two columns (a price summary, an electrical circuit). */
export function Pairs({
  pairs,
  labelFlex = 3,
  valueFlex = 2,
}: {
  pairs: readonly { label: string; value: string; strong?: boolean }[];
  labelFlex?: number;
  valueFlex?: number;
}) {
  return (
    <View style={s.table}>
      {pairs.map((p) => (
        <View key={p.label} style={p.strong ? [s.tr, s.totalRow] : s.tr} wrap={false}>
          <Text style={[s.cell, s.firstCell, { flex: labelFlex }]}>{p.label}</Text>
          <Text style={[s.cell, s.lastCell, s.num, { flex: valueFlex }]}>{p.value}</Text>
        </View>
      ))}
    </View>
  );
}

export function Bullets({ items }: { items: readonly string[] }) {
  return (
    <View>
      {items.map((item, i) => (
        <View key={`${i}:${item}`} style={s.bullet} wrap={false}>
          <Text style={s.bulletMark}>•</Text>
          <Text style={s.bulletText}>{item}</Text>
        </View>
      ))}
    </View>
  );
}

/** A person's multi-line text (terms, warranty) as printed paragraphs, or `empty` when there is none. */
export function Paragraphs({ text, empty }: { text: string; empty: string }) {
  const ps = paragraphs(text);
  if (ps.length === 0) return <Text style={[s.p, s.small]}>{empty}</Text>;
  return (
    <View>
      {ps.map((p, i) => (
        <Text key={i} style={s.p}>
          {p}
        </Text>
      ))}
    </View>
  );
}
