/** @jsxRuntime automatic */
import { Text, View } from '@react-pdf/renderer';
import type { PackSnapshot, SnapshotZone } from '../snapshot';
import {
  formatDateTime,
  gradeText,
  LOOP_STATE_NAMES,
  romanClass,
  SITING_NAMES,
  type ReadingState,
} from './format';
import {
  PackPage,
  Reading,
  SectionHeading,
  StateWord,
  Subheading,
  Table,
  type Column,
} from './layout';
import { LoopGauge } from './loop-gauge';
import { colours, styles, verdict } from './styles';

export const ZONE_COLUMNS: Column[] = [
  { header: 'Zone', weight: 0.45 },
  { header: 'Location', weight: 1.6 },
  { header: 'Area', weight: 0.9 },
  { header: 'Zone type', weight: 0.95 },
  { header: 'Detector', weight: 1.5 },
  { header: 'Wiring', weight: 1.45 },
  { header: 'Expected secure / alarm', weight: 1.15 },
  { header: 'Measured secure / alarm', weight: 1.55 },
  { header: 'Result', weight: 0.75 },
  { header: 'Siting', weight: 0.9 },
  { header: 'Tested when / by', weight: 1.25 },
];

/** Landscape A4 less the page margins, in points. */
const TABLE_WIDTH = 841.89 - 80;
const GAUGE_INDENT =
  (ZONE_COLUMNS[0]!.weight / ZONE_COLUMNS.reduce((sum, column) => sum + column.weight, 0)) *
    TABLE_WIDTH +
  3;
const GAUGE_WIDTH = 430;

const STATE_COLOURS: Record<ReadingState, string> = {
  normal: colours.normal,
  alarm: colours.alarm,
  open_circuit: colours.fault,
  short_circuit: colours.fault,
  out_of_tolerance: colours.fault,
};

function ExpectedReadings(props: { zone: SnapshotZone }) {
  const { normalOhms, alarmOhms } = props.zone.expected;
  const opensInAlarm = props.zone.bands.some(
    (band) => band.state === 'alarm' && band.highOhms === null,
  );
  return (
    <View>
      {normalOhms === null ? <Text>—</Text> : <Reading ohms={normalOhms} />}
      {alarmOhms !== null ? (
        <Reading ohms={alarmOhms} />
      ) : (
        <Text>{opensInAlarm ? 'Open circuit' : '—'}</Text>
      )}
    </View>
  );
}

function MeasuredLine(props: { ohms: number | null; state: ReadingState }) {
  return (
    <Text>
      {props.ohms === null ? <Text style={styles.mono}>OL</Text> : <Reading ohms={props.ohms} />}
      {' · '}
      <Text style={{ color: STATE_COLOURS[props.state], fontWeight: 600 }}>
        {LOOP_STATE_NAMES[props.state]}
      </Text>
    </Text>
  );
}

function MeasuredReadings(props: { zone: SnapshotZone }) {
  const measured = props.zone.measured;
  if (!measured) return <Text style={{ color: colours.fault }}>Not tested</Text>;
  return (
    <View>
      <MeasuredLine ohms={measured.secureOhms} state={measured.secureState} />
      {measured.activated && measured.alarmState !== null ? (
        <MeasuredLine ohms={measured.alarmOhms} state={measured.alarmState} />
      ) : (
        <Text style={{ color: colours.fault }}>Not activated</Text>
      )}
    </View>
  );
}

function zoneRow(zone: SnapshotZone) {
  const measured = zone.measured;
  const result = measured
    ? verdict(measured.passed)
    : { word: 'NOT TESTED', colour: colours.fault };
  const siting = SITING_NAMES[zone.siting];
  return {
    key: zone.number,
    cells: [
      <Text key="number" style={[styles.mono, styles.bold]}>
        {String(zone.number).padStart(2, '0')}
      </Text>,
      <Text key="location" style={styles.bold}>
        {zone.location}
      </Text>,
      zone.area ?? '—',
      zone.zoneType,
      <View key="detector">
        <Text>{zone.detectorKind}</Text>
        {zone.grade !== null || zone.environmentalClass !== null ? (
          <Text style={[styles.small, styles.muted]}>
            {gradeText(zone.grade)} · {romanClass(zone.environmentalClass)}
          </Text>
        ) : null}
      </View>,
      zone.wiring,
      <ExpectedReadings key="expected" zone={zone} />,
      <MeasuredReadings key="measured" zone={zone} />,
      <StateWord key="result" word={result.word} colour={result.colour} />,
      zone.siting === 'needs_attention' ? (
        <Text key="siting" style={{ color: colours.fault, fontWeight: 600 }}>
          {siting}
        </Text>
      ) : zone.siting === 'not_applicable' ? (
        <Text key="siting" style={styles.muted}>
          {siting}
        </Text>
      ) : (
        siting
      ),
      measured ? (
        <View key="tested">
          <Text>{formatDateTime(measured.testedAt)}</Text>
          <Text style={styles.muted}>{measured.testedBy ?? 'engineer not recorded'}</Text>
        </View>
      ) : (
        '—'
      ),
    ],
    below: (
      <View style={{ marginLeft: GAUGE_INDENT, marginBottom: 3 }}>
        {zone.bands.length > 0 ? (
          <LoopGauge bands={zone.bands} measuredOhms={measured?.secureOhms} width={GAUGE_WIDTH} />
        ) : (
          <Text style={[styles.small, styles.muted]}>No loop bands: resistor values missing.</Text>
        )}
      </View>
    ),
  };
}

export function ZoneSchedule(props: { snapshot: PackSnapshot }) {
  const { snapshot } = props;
  const zones = [...snapshot.zones].sort((a, b) => a.number - b.number);
  const passed = zones.filter((zone) => zone.measured?.passed).length;
  return (
    <PackPage snapshot={snapshot} orientation="landscape">
      <SectionHeading kicker="Section 2" title="As-fitted zone schedule" />
      <Text style={styles.paragraph}>
        Every zone as fitted, with the loop readings its resistors should give and what the engineer
        measured at the walk test. {zones.length} zones; {passed} passed.
      </Text>
      <View style={[styles.panel, { marginBottom: 8, paddingVertical: 5 }]}>
        <Text style={styles.small}>
          Loop gauge: resistance on a logarithmic scale from 1 Ω to 1 MΩ (ticks at each power of
          ten). Coloured bands show where the panel reads short circuit, normal, alarm and open
          circuit, each widened by the resistors&rsquo; tolerance and the cable&rsquo;s resistance;
          a reading in an uncoloured gap is out of tolerance. The arrow marks the measured secure
          reading. Siting applies to movement detectors: not facing windows or heat sources, out of
          direct sun and draughts, away from insects and pets&rsquo; reach.
        </Text>
      </View>
      <Table columns={ZONE_COLUMNS} rows={zones.map(zoneRow)} empty="No zones recorded." />

      <Subheading>Devices</Subheading>
      <Table
        columns={[
          { header: 'Device', weight: 2 },
          { header: 'Location', weight: 3 },
          { header: 'Grade', weight: 1 },
          { header: 'Environmental class', weight: 1.2 },
        ]}
        rows={snapshot.devices.map((device, index) => ({
          key: index,
          cells: [
            device.kind,
            device.location,
            gradeText(device.grade),
            romanClass(device.environmentalClass),
          ],
        }))}
        empty="No devices recorded."
      />
    </PackPage>
  );
}
