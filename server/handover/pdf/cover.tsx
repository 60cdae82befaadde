/** @jsxRuntime automatic */
import { Image, Text, View } from '@react-pdf/renderer';
import type { PackSnapshot } from '../snapshot';
import { breakUrl, formatLongDate, gradeText, romanClass } from './format';
import { Mono, PackPage } from './layout';
import { colours, styles } from './styles';

/** What the pack holds, in order; the cover lists it so a reader knows what to expect. */
export const PACK_CONTENTS = [
  'Completion certificate',
  'As-fitted zone schedule and devices',
  'Power budget',
  'Keyholders, user-code slots and monitoring',
  'Service plan',
  'User guide',
  'Safety cautions',
  'Sign-off',
];

export function Cover(props: { snapshot: PackSnapshot; qrDataUrl: string }) {
  const { snapshot } = props;
  const { site, system, installer } = snapshot;
  return (
    <PackPage snapshot={snapshot}>
      <View style={{ borderTopWidth: 6, borderTopColor: colours.ink, paddingTop: 14 }}>
        <Text style={[styles.sectionKicker, { fontSize: 9 }]}>Intruder alarm system</Text>
        <Text style={{ fontSize: 34, lineHeight: 1.15, fontWeight: 700, marginTop: 2 }}>
          Handover pack
        </Text>
        <Text style={[styles.muted, { fontSize: 10, marginTop: 2 }]}>
          The record of the system as fitted, tested and handed over.
        </Text>
      </View>

      <View style={{ flexDirection: 'row', marginTop: 22 }}>
        <View style={{ flex: 1, paddingRight: 18 }}>
          <Text style={styles.label}>Pack number</Text>
          <Mono style={{ fontSize: 20, lineHeight: 1.2, fontWeight: 600 }}>
            {snapshot.packNumber}
          </Mono>
          <Text style={{ marginTop: 3 }}>
            Revision {snapshot.revision}
            {snapshot.supersedes ? (
              <Text>
                {' '}
                — supersedes <Mono>{snapshot.supersedes}</Mono>
              </Text>
            ) : null}
          </Text>
          <Text style={[styles.label, { marginTop: 12 }]}>
            {snapshot.preview ? 'Preview drawn' : 'Issued'}
          </Text>
          <Text style={{ fontSize: 12, lineHeight: 1.3, fontWeight: 600 }}>
            {formatLongDate(snapshot.issuedAt)}
          </Text>
        </View>
        <View style={[styles.panel, { width: 180, alignItems: 'center' }]}>
          <Image src={props.qrDataUrl} style={{ width: 112, height: 112 }} />
          <Text style={{ fontSize: 8, fontWeight: 600, marginTop: 4, textAlign: 'center' }}>
            Check this pack is genuine
          </Text>
          <View style={{ marginTop: 2, alignItems: 'center' }}>
            {breakUrl(snapshot.verifyUrl, 40).map((line, index) => (
              <Mono key={index} style={{ fontSize: 6.5 }}>
                {line}
              </Mono>
            ))}
          </View>
        </View>
      </View>

      <View style={{ flexDirection: 'row', marginTop: 20 }}>
        <View style={[styles.card, { flex: 1, marginRight: 10 }]}>
          <Text style={styles.label}>Site</Text>
          <Text style={{ fontSize: 12, lineHeight: 1.3, fontWeight: 600 }}>{site.name}</Text>
          {site.addressLines.map((line) => (
            <Text key={line}>{line}</Text>
          ))}
          <Text style={[styles.muted, { marginTop: 4 }]}>
            Site reference <Mono>{site.reference}</Mono>
          </Text>
        </View>
        <View style={[styles.card, { flex: 1 }]}>
          <Text style={styles.label}>Installed and maintained by</Text>
          <Text style={{ fontSize: 12, lineHeight: 1.3, fontWeight: 600 }}>{installer.name}</Text>
          {installer.addressLines.map((line) => (
            <Text key={line}>{line}</Text>
          ))}
          <Text style={{ marginTop: 4 }}>
            Telephone <Mono>{installer.phone}</Mono>
          </Text>
          <Text>{installer.email}</Text>
        </View>
      </View>

      <View style={[styles.card, { marginTop: 10 }]}>
        <Text style={styles.label}>System</Text>
        <Text style={{ fontSize: 11, lineHeight: 1.3, fontWeight: 600 }}>
          {system.controlPanel}
        </Text>
        <Text>
          Firmware <Mono>{system.firmware || '—'}</Mono> · control panel in{' '}
          {system.panelLocation || 'a location not recorded'}
        </Text>
        <Text>
          System {gradeText(system.grade).toLowerCase()} (site requires grade {site.requiredGrade})
          · environmental {romanClass(site.environmentalClass)} · {snapshot.zones.length} zones
        </Text>
      </View>

      <View style={{ marginTop: 20 }}>
        <Text style={styles.label}>In this pack</Text>
        {PACK_CONTENTS.map((entry, index) => (
          <View key={entry} style={{ flexDirection: 'row', marginTop: 2 }}>
            <Mono style={{ width: 18, color: colours.brass }}>{String(index + 1)}</Mono>
            <Text>{entry}</Text>
          </View>
        ))}
      </View>
    </PackPage>
  );
}
