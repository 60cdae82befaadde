/** @jsxRuntime automatic */
import { Text, View } from '@react-pdf/renderer';
import type { PackSnapshot } from '../snapshot';
import { Bullets, PackPage, SectionHeading, Subheading } from './layout';
import { colours, styles } from './styles';

export function Safety(props: { snapshot: PackSnapshot }) {
  const { snapshot } = props;
  return (
    <PackPage snapshot={snapshot}>
      <SectionHeading kicker="Section 6" title="Safety cautions" />
      <Text style={styles.paragraph}>
        These are reminders, not a risk assessment. Local codes, the law where you are, your
        employer’s safe systems of work and licensed practice come first wherever they differ from
        this page.
      </Text>

      {snapshot.site.hazards ? (
        <View
          style={[
            styles.panel,
            { borderLeftWidth: 3, borderLeftColor: colours.fault, marginBottom: 6 },
          ]}
          wrap={false}
        >
          <Text style={styles.label}>Hazards recorded at this site</Text>
          <Text>{snapshot.site.hazards}</Text>
        </View>
      ) : null}

      <Subheading>For everyone at home</Subheading>
      <Bullets
        items={[
          'Do not open the control panel, detectors or sounders. The panel is connected to the mains and holds a battery that can deliver a large current.',
          'Do not climb to reach a detector or the external sounder; call us.',
          'If the alarm sounds and you are away, do not hurry home alone to investigate.',
        ]}
      />

      <Subheading>For keyholders attending an alarm</Subheading>
      <Bullets
        items={[
          'Never go in where there are signs of forced entry: a broken window, a forced door, or someone inside. Wait at a safe distance for the police, and call 999 from a safe place.',
          'Attend in pairs where you can, and tell someone where you are going.',
          'Take your phone, and do not put yourself at risk to protect property.',
        ]}
      />

      <Subheading>For engineers working on this system</Subheading>
      <Bullets
        items={[
          'Ladders (HSE INDG455): only for short-duration, light work, as a guide no more than 30 minutes in one position; set at a 1-in-4 angle (one out for every four up, about 75°); keep three points of contact; extend the ladder 1 m above any landing point.',
          'Before drilling, check for hidden cables and pipes with a detector: cables can run outside the expected safe zones.',
          'Isolate the mains and prove it dead before opening the panel (lock off, prove the tester, test, prove the tester again); disconnect the standby battery. Mains work is for a competent person, to BS 7671.',
          'Asbestos is possible in any building built or refurbished before 2000. Ask for the asbestos register; if you suspect asbestos, stop work and do not drill.',
          'Lone working (HSE INDG73): tell someone where you are and when you expect to finish, and check in as your employer arranges.',
        ]}
      />
    </PackPage>
  );
}
