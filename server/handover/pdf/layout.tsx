/** @jsxRuntime automatic */
import type { ReactNode } from 'react';
import { Page, Text, View } from '@react-pdf/renderer';
import type { Styles } from '@react-pdf/renderer';
import type { PackSnapshot } from '../snapshot';
import { ohmsParts } from './format';
import { colours, styles } from './styles';

type Style = Styles[string];

/**
 * One page (or run of wrapped pages) of the pack, with the fixed furniture every page
 * carries: the footer naming installer, site, pack number and page, and in a preview a
 * marking that the pack has not been issued.
 */
export function PackPage(props: {
  snapshot: PackSnapshot;
  orientation?: 'portrait' | 'landscape';
  children: ReactNode;
}) {
  const { snapshot } = props;
  return (
    <Page size="A4" orientation={props.orientation ?? 'portrait'} style={styles.page} wrap>
      {snapshot.preview ? (
        <>
          <Text style={styles.previewWatermark} fixed>
            PREVIEW
          </Text>
          <Text style={styles.previewBanner} fixed>
            PREVIEW — not issued. This draft is not sealed and is not a record of handover.
          </Text>
        </>
      ) : null}
      {props.children}
      <View style={styles.footer} fixed>
        <View style={{ width: 160 }}>
          <Text>{snapshot.installer.name}</Text>
          <Text>{snapshot.site.name}</Text>
        </View>
        <View style={{ flex: 1, alignItems: 'center' }}>
          <Text style={styles.label}>Handover pack</Text>
          <Text style={[styles.mono, { color: colours.ink, fontSize: 8 }]}>
            {snapshot.packNumber} · rev {snapshot.revision}
          </Text>
        </View>
        <Text
          style={{ width: 160, textAlign: 'right' }}
          render={({ pageNumber, totalPages }) => `Page ${pageNumber} of ${totalPages}`}
        />
      </View>
    </Page>
  );
}

export function SectionHeading(props: { kicker?: string; title: string }) {
  return (
    <View style={styles.sectionHeading} minPresenceAhead={80} wrap={false}>
      {props.kicker ? <Text style={styles.sectionKicker}>{props.kicker}</Text> : null}
      <Text style={styles.sectionTitle}>{props.title}</Text>
    </View>
  );
}

export function Subheading(props: { children: ReactNode }) {
  return (
    <Text style={styles.subheading} minPresenceAhead={40}>
      {props.children}
    </Text>
  );
}

export function Field(props: { name: string; children: ReactNode; nameWidth?: number }) {
  return (
    <View style={styles.fieldRow} wrap={false}>
      <Text style={[styles.fieldName, props.nameWidth ? { width: props.nameWidth } : {}]}>
        {props.name}
      </Text>
      <View style={styles.fieldValue}>
        {typeof props.children === 'string' ? <Text>{props.children}</Text> : props.children}
      </View>
    </View>
  );
}

export function Bullets(props: { items: ReactNode[] }) {
  return (
    <View>
      {props.items.map((item, index) => (
        <View key={index} style={styles.bulletRow} wrap={false}>
          <Text style={styles.bullet}>•</Text>
          <Text style={styles.bulletText}>{item}</Text>
        </View>
      ))}
    </View>
  );
}

/** Monospaced text for account, pack and phone numbers; readings go through <Reading>. */
export function Mono(props: { children: ReactNode; style?: Style }) {
  return <Text style={[styles.mono, props.style ?? {}]}>{props.children}</Text>;
}

/** A resistance: number in Plex Mono, unit in Plex Sans (the mono face has no Ω). */
export function Reading(props: { ohms: number }) {
  const { value, unit } = ohmsParts(props.ohms);
  return (
    <Text>
      <Text style={styles.mono}>{value}</Text> {unit}
    </Text>
  );
}

/** A word in its state colour: PASS, FAIL, Normal… */
export function StateWord(props: { word: string; colour: string; size?: number }) {
  return (
    <Text
      style={{
        color: props.colour,
        fontWeight: 700,
        ...(props.size ? { fontSize: props.size, lineHeight: 1.25 } : {}),
      }}
    >
      {props.word}
    </Text>
  );
}

export interface Column {
  header: string;
  /** Relative width; the table shares its full width out in these proportions. */
  weight: number;
  align?: 'left' | 'right' | 'center';
}

export interface TableRow {
  key: string | number;
  cells: ReactNode[];
  /** Drawn beneath the cells, inside the same unsplittable row (the zone schedule's gauge). */
  below?: ReactNode;
}

/**
 * A table whose header row repeats at the top of every page it runs onto (a `fixed` child
 * of the wrapping table view) and whose rows are never split between pages.
 */
export function Table(props: { columns: Column[]; rows: TableRow[]; empty?: string }) {
  const total = props.columns.reduce((sum, column) => sum + column.weight, 0);
  const widths = props.columns.map((column) => `${((column.weight / total) * 100).toFixed(3)}%`);
  const cellStyle = (index: number): Style => ({
    width: widths[index],
    textAlign: props.columns[index]?.align ?? 'left',
  });
  return (
    <View style={styles.table}>
      <View style={styles.tableHeader} fixed>
        {props.columns.map((column, index) => (
          <Text key={column.header} style={[styles.tableHeaderCell, cellStyle(index)]}>
            {column.header}
          </Text>
        ))}
      </View>
      {props.rows.length === 0 ? (
        <View style={styles.tableRow}>
          <Text style={[styles.tableCell, styles.muted]}>{props.empty ?? 'None recorded.'}</Text>
        </View>
      ) : (
        props.rows.map((row) => (
          <View key={row.key} style={styles.tableRow} wrap={false}>
            <View style={styles.tableCells}>
              {row.cells.map((cell, index) => (
                <View key={index} style={[styles.tableCell, cellStyle(index)]}>
                  {typeof cell === 'string' || typeof cell === 'number' ? (
                    <Text>{cell}</Text>
                  ) : (
                    cell
                  )}
                </View>
              ))}
            </View>
            {row.below}
          </View>
        ))
      )}
    </View>
  );
}
