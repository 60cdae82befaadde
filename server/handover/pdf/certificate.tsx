/** @jsxRuntime automatic */
import { Text, View } from '@react-pdf/renderer';
import type { PackSnapshot } from '../snapshot';
import { formatDateTime, formatLongDate, gradeText, notificationText, romanClass } from './format';
import { Bullets, Field, PackPage, SectionHeading, StateWord, Subheading, Table } from './layout';
import { colours, styles, verdict } from './styles';

type TestResult = PackSnapshot['tests']['sounders'];

function testRow(name: string, result: TestResult) {
  const outcome = verdict(result?.passed ?? null);
  return {
    key: name,
    cells: [
      <Text key="name" style={styles.bold}>
        {name}
      </Text>,
      <StateWord key="result" word={outcome.word} colour={outcome.colour} />,
      result ? formatDateTime(result.testedAt) : '—',
      result?.summary ?? 'No test recorded.',
    ],
  };
}

export function Certificate(props: { snapshot: PackSnapshot }) {
  const { snapshot } = props;
  const { site, system } = snapshot;
  const belowRequired = system.grade !== null && system.grade < site.requiredGrade;
  return (
    <PackPage snapshot={snapshot}>
      <SectionHeading kicker="Section 1" title="Completion certificate" />
      <Text style={styles.paragraph}>
        {snapshot.installer.name} certifies that the intruder alarm system at {site.name} was
        installed, commissioned and tested as recorded in this pack, to the standards listed below,
        subject only to the variations listed.
      </Text>

      <Subheading>Grade and environment</Subheading>
      <Field name="Premises">{site.premisesType === 'domestic' ? 'Domestic' : 'Commercial'}</Field>
      <Field name="Grade the site requires">
        <Text style={styles.bold}>Grade {site.requiredGrade}</Text>
        <Text style={styles.muted}>{site.gradeRationale}</Text>
      </Field>
      <Field name="System grade as fitted">
        <Text style={styles.bold}>{gradeText(system.grade)}</Text>
        {system.gradeLimitedBy.length > 0 ? (
          <Text style={styles.muted}>
            Limited by: {system.gradeLimitedBy.join('; ')}. A system takes the grade of its
            lowest-graded part (EN 50131-1).
          </Text>
        ) : null}
        {belowRequired ? (
          <Text style={{ color: colours.fault, fontWeight: 600 }}>
            Below the grade the site requires — see variations.
          </Text>
        ) : null}
      </Field>
      <Field name="Environmental class">{romanClass(site.environmentalClass)}</Field>
      <Field name="Notification">{notificationText(system.notification)}</Field>
      <Field name="Power supply">
        {`${system.psuType ? `Type ${system.psuType}` : 'Type not recorded'}${
          system.batteryAh !== null ? `, ${system.batteryAh} Ah standby battery` : ''
        }`}
      </Field>
      {site.riskNotes ? <Field name="Risk notes">{site.riskNotes}</Field> : null}

      <Subheading>Standards</Subheading>
      {system.standards.length > 0 ? (
        <Bullets items={system.standards} />
      ) : (
        <Text style={styles.muted}>None recorded.</Text>
      )}

      <Subheading>Variations the customer accepted</Subheading>
      {snapshot.variations.length > 0 ? (
        <Table
          columns={[
            { header: 'Variation', weight: 4 },
            { header: 'Accepted', weight: 1 },
          ]}
          rows={snapshot.variations.map((variation, index) => ({
            key: index,
            cells: [
              variation.text,
              variation.acceptedAt ? formatLongDate(variation.acceptedAt) : 'Not yet accepted',
            ],
          }))}
        />
      ) : (
        <Text>None. The system met every pre-issue check.</Text>
      )}

      <Subheading>Commissioning tests</Subheading>
      <Table
        columns={[
          { header: 'Test', weight: 1.1 },
          { header: 'Result', weight: 1 },
          { header: 'When', weight: 1.3 },
          { header: 'What was seen', weight: 4 },
        ]}
        rows={[
          testRow('Sounders', snapshot.tests.sounders),
          testRow('Signalling', snapshot.tests.signalling),
          testRow('Battery', snapshot.tests.battery),
        ]}
      />
      <View style={{ marginTop: 4 }}>
        <Text style={[styles.small, styles.muted]}>
          Every zone&apos;s walk test is in the zone schedule that follows.
        </Text>
      </View>
    </PackPage>
  );
}
