/** @jsxRuntime automatic */
// The pragma above: `tsx` reads the root tsconfig.json, which sets no "jsx" option.
import type { ReactNode } from 'react';
import { Document, Image, Page, renderToBuffer, Text, View } from '@react-pdf/renderer';
import { registerPackFonts } from '../../handover/pdf/fonts';
import { formatDateTime, formatLongDate, LOOP_STATE_NAMES } from '../../handover/pdf/format';
import { signatureImage } from '../../handover/pdf/images';
import {
  Bullets,
  Field,
  Mono,
  Reading,
  SectionHeading,
  StateWord,
  Subheading,
  Table,
} from '../../handover/pdf/layout';
import { colours, styles, verdict } from '../../handover/pdf/styles';
import type { ServiceReportSnapshot } from '../schema';

type Snapshot = ServiceReportSnapshot;
type Preventive = NonNullable<Snapshot['visit']['preventive']>;
type Corrective = NonNullable<Snapshot['visit']['corrective']>;
type ZoneResult = Preventive['zones'][number];

const RESULT_WORDS = { passed: 'Passed', failed: 'Failed', none_fitted: 'None fitted' } as const;
const resultColour = (result: keyof typeof RESULT_WORDS) =>
  result === 'passed' ? colours.normal : result === 'failed' ? colours.alarm : colours.info;

/** A calendar date ("2027-06-01") or an instant, read as the UK reads it. */
const longDate = (value: string) =>
  formatLongDate(value.length === 10 ? `${value}T12:00:00Z` : value);

/** Every page: the furniture naming installer, site, visit and page. */
function ReportPage(props: { snapshot: Snapshot; children: ReactNode }) {
  const { snapshot } = props;
  return (
    <Page size="A4" style={styles.page} wrap>
      {props.children}
      <View style={styles.footer} fixed>
        <View style={{ width: 160 }}>
          <Text>{snapshot.installer.name}</Text>
          <Text>{snapshot.site.name}</Text>
        </View>
        <View style={{ flex: 1, alignItems: 'center' }}>
          <Text style={styles.label}>Service report</Text>
          <Text>{longDate(snapshot.visit.completedAt!)}</Text>
        </View>
        <Text
          style={{ width: 160, textAlign: 'right' }}
          render={({ pageNumber, totalPages }) => `Page ${pageNumber} of ${totalPages}`}
        />
      </View>
    </Page>
  );
}

function Summary(props: { snapshot: Snapshot }) {
  const { visit, site, installer } = props.snapshot;
  const outcome = visit.outcome;
  const word =
    outcome.passed === null
      ? { word: 'CALL-OUT DONE', colour: colours.info }
      : verdict(outcome.passed);
  return (
    <View>
      <SectionHeading
        kicker={visit.kind === 'preventive' ? 'Preventive maintenance visit' : 'Corrective visit'}
        title={`Service report: ${site.name}`}
      />
      <Field name="Site">
        <Text>
          {site.name} (<Mono>{site.reference}</Mono>)
        </Text>
        {site.addressLines.map((line) => (
          <Text key={line}>{line}</Text>
        ))}
      </Field>
      <Field name="Installer">{installer.name}</Field>
      <Field name="Engineer">{visit.engineer?.name ?? 'Not recorded'}</Field>
      <Field name="Visit due">{longDate(visit.dueDate)}</Field>
      <Field name="Completed">{formatDateTime(visit.completedAt!)}</Field>
      {visit.nextDueOn ? (
        <Field name="Next preventive visit due">{longDate(visit.nextDueOn)}</Field>
      ) : null}
      <View style={[styles.panel, { marginTop: 8, marginBottom: 6 }]} wrap={false}>
        <Text style={styles.label}>Outcome</Text>
        <StateWord word={word.word} colour={word.colour} size={13} />
        <Text>{outcome.words}</Text>
      </View>
      {outcome.findings.length > 0 ? (
        <>
          <Subheading>Findings to put right</Subheading>
          <Bullets items={outcome.findings} />
        </>
      ) : null}
    </View>
  );
}

function ReadingCell(props: { ohms: number | null; open: boolean }) {
  if (props.open) return <Mono>OL</Mono>;
  if (props.ohms === null) return <Text style={styles.muted}>—</Text>;
  return <Reading ohms={props.ohms} />;
}

function stateName(state: ZoneResult['secureState']) {
  return state ? LOOP_STATE_NAMES[state] : 'Not classified';
}

function BatterySection(props: { battery: Preventive['battery'] }) {
  const { battery } = props;
  if (!battery) return null;
  const word = verdict(battery.passed);
  return (
    <View wrap={false}>
      <Subheading>Standby battery</Subheading>
      <Field name="Voltage at rest">
        <Text>
          <Mono>{battery.restingVolts.toFixed(2)}</Mono> V
        </Text>
      </Field>
      <Field name="Voltage under load">
        <Text>
          <Mono>{battery.loadTestVolts.toFixed(2)}</Mono> V
          {battery.loadTestAmps === null ? '' : ` at ${battery.loadTestAmps} A`}
        </Text>
      </Field>
      <Field name="Battery verdict">
        <StateWord word={word.word} colour={word.colour} />
      </Field>
      {battery.reasons.length > 0 ? <Bullets items={battery.reasons} /> : null}
      {battery.notes.length > 0 ? <Bullets items={battery.notes} /> : null}
    </View>
  );
}

function ZoneTable(props: { zones: ZoneResult[] }) {
  return (
    <View>
      <Subheading>Zones walk-tested</Subheading>
      <Table
        columns={[
          { header: 'Zone', weight: 6 },
          { header: 'Location', weight: 18 },
          { header: 'Set reading', weight: 11, align: 'right' },
          { header: 'Set reads as', weight: 13 },
          { header: 'Triggered reading', weight: 12, align: 'right' },
          { header: 'Triggered reads as', weight: 13 },
          { header: 'Result', weight: 27 },
        ]}
        rows={props.zones.map((zone) => {
          const word = verdict(zone.passed);
          return {
            key: zone.zoneId,
            cells: [
              <Mono key="n">{String(zone.number)}</Mono>,
              zone.location,
              <ReadingCell key="s" ohms={zone.secureReadingOhms} open={zone.secureOpen} />,
              stateName(zone.secureState),
              <ReadingCell key="a" ohms={zone.alarmReadingOhms} open={zone.alarmOpen} />,
              zone.alarmReadingOhms === null && !zone.alarmOpen ? '—' : stateName(zone.alarmState),
              <View key="r">
                <StateWord word={word.word} colour={word.colour} />
                {zone.failures.map((failure) => (
                  <Text key={failure} style={styles.small}>
                    {failure}
                  </Text>
                ))}
              </View>,
            ],
          };
        })}
        empty="No zones were walk-tested."
      />
    </View>
  );
}

function ChecksSection(props: { preventive: Preventive }) {
  const { tampers, sounders, signalling } = props.preventive;
  const rows: { label: string; result: keyof typeof RESULT_WORDS; note: string }[] = [
    ...(tampers ? [{ label: 'Tampers', ...tampers }] : []),
    ...(sounders.internal ? [{ label: 'Internal sounders', ...sounders.internal }] : []),
    ...(sounders.external ? [{ label: 'External sounders', ...sounders.external }] : []),
    ...signalling.map((path) => ({
      label: `Signalling path ${path.position} (${path.bearer}): ${path.description}`,
      result: path.result,
      note: path.centreReference ? `Centre reference ${path.centreReference}` : '',
    })),
  ];
  return (
    <View>
      <Subheading>Tests</Subheading>
      <Table
        columns={[
          { header: 'Check', weight: 45 },
          { header: 'Result', weight: 15 },
          { header: 'Note', weight: 40 },
        ]}
        rows={rows.map((row) => ({
          key: row.label,
          cells: [
            row.label,
            <StateWord key="r" word={RESULT_WORDS[row.result]} colour={resultColour(row.result)} />,
            row.note,
          ],
        }))}
        empty="No further checks recorded."
      />
    </View>
  );
}

function NotTestedSection(props: { snapshot: Snapshot; preventive: Preventive }) {
  const { notTested } = props.preventive;
  if (notTested.length === 0) return null;
  const { snapshot } = props;
  return (
    <View>
      <Subheading>Not tested on this visit</Subheading>
      <Table
        columns={[
          { header: 'Item', weight: 40 },
          { header: 'Why', weight: 60 },
        ]}
        rows={notTested.map((entry) => ({
          key: entry.label,
          cells: [entry.label, entry.reason],
        }))}
      />
      <View style={[styles.card, { width: 260 }]} wrap={false}>
        <Text style={styles.label}>Customer’s signature for the items not tested</Text>
        <View style={{ height: 70, justifyContent: 'flex-end', marginBottom: 4 }}>
          {snapshot.customerSignature ? (
            <Image
              src={signatureImage(snapshot.customerSignature)}
              style={{ height: 64, objectFit: 'contain' }}
            />
          ) : (
            <Text style={styles.muted}>No signature recorded.</Text>
          )}
        </View>
        <Text>
          <Text style={styles.muted}>Name </Text>
          {snapshot.visit.customerSignedBy ?? ''}
        </Text>
      </View>
    </View>
  );
}

function PreventiveDetail(props: { snapshot: Snapshot; preventive: Preventive }) {
  const { preventive } = props;
  return (
    <View>
      <BatterySection battery={preventive.battery} />
      <ZoneTable zones={preventive.zones} />
      <ChecksSection preventive={preventive} />
      <Subheading>The people who use the system</Subheading>
      <Field name="User training given">{preventive.userTrainingGiven ? 'Yes' : 'No'}</Field>
      <Field name="User confidence">
        <Text>
          <Mono>{String(preventive.userConfidence.score)}</Mono> of 5,{' '}
          {preventive.userConfidence.words}
        </Text>
      </Field>
      {preventive.note ? <Field name="Engineer’s note">{preventive.note}</Field> : null}
      <NotTestedSection snapshot={props.snapshot} preventive={preventive} />
    </View>
  );
}

function CorrectiveDetail(props: { corrective: Corrective }) {
  const { corrective } = props;
  return (
    <View>
      <Subheading>The call-out</Subheading>
      <Field name="Fault reported">{corrective.reportedFault ?? 'Not recorded'}</Field>
      <Field name="Prime cause">{corrective.primeCauseLabel}</Field>
      <Field name="Action taken">{corrective.actionTaken}</Field>
      <Field name="Parts replaced">
        {corrective.partsReplaced.length === 0
          ? 'None'
          : corrective.partsReplaced.map((part) => `${part.quantity} × ${part.part}`).join(', ')}
      </Field>
      <Field name="False alarm">
        {corrective.falseAlarm ? `Yes: ${corrective.falseAlarmCause ?? ''}` : 'No'}
      </Field>
      {corrective.note ? <Field name="Engineer’s note">{corrective.note}</Field> : null}
    </View>
  );
}

/** Short cautions: a service report is read by the homeowner and by the next engineer. */
function SafetyNote(props: { hazards: string }) {
  return (
    <View style={[styles.panel, { marginTop: 12 }]} wrap={false}>
      <Text style={styles.label}>Safety</Text>
      {props.hazards ? (
        <Text style={{ marginBottom: 3 }}>Hazards recorded at this site: {props.hazards}</Text>
      ) : null}
      <Bullets
        items={[
          'At home: do not open the panel, detectors or sounders, and do not climb to reach them; call your installer.',
          'Keyholders: never go in where there are signs of forced entry; wait at a safe distance for the police.',
          'Engineers: working at height, hidden cables and pipes before drilling, mains isolation before opening the panel, possible asbestos in older buildings, and lone working all need the usual precautions.',
          'Local codes, the law where you are and licensed practice come first wherever they differ from this note.',
        ]}
      />
    </View>
  );
}

export function ServiceReport(props: { snapshot: Snapshot }) {
  const { snapshot } = props;
  const prepared = new Date(snapshot.preparedAt);
  return (
    <Document
      title={`Service report — ${snapshot.site.name}, ${longDate(snapshot.visit.completedAt!)}`}
      author={snapshot.installer.name}
      subject={`Intruder alarm ${snapshot.visit.kind} service visit report`}
      creator="Wardbook"
      producer="Wardbook"
      language="en-GB"
      creationDate={prepared}
      modificationDate={prepared}
    >
      <ReportPage snapshot={snapshot}>
        <Summary snapshot={snapshot} />
        {snapshot.visit.preventive ? (
          <PreventiveDetail snapshot={snapshot} preventive={snapshot.visit.preventive} />
        ) : null}
        {snapshot.visit.corrective ? (
          <CorrectiveDetail corrective={snapshot.visit.corrective} />
        ) : null}
        <SafetyNote hazards={snapshot.site.hazards} />
      </ReportPage>
    </Document>
  );
}

/** Draws a service report from its snapshot: the snapshot is the only input. */
export async function renderServiceReportPdf(snapshot: Snapshot): Promise<Buffer> {
  registerPackFonts();
  return renderToBuffer(<ServiceReport snapshot={snapshot} />);
}
