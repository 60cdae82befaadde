/** @jsxRuntime automatic */
import { Text, View } from '@react-pdf/renderer';
import type { PackSnapshot } from '../snapshot';
import { Bullets, Mono, PackPage, SectionHeading, Subheading } from './layout';
import { styles } from './styles';

/** The zones on the way in and out, in zone order: what the entry timer covers. */
function entryRoute(snapshot: PackSnapshot): string[] {
  return [...snapshot.zones]
    .filter((zone) => /^entry/i.test(zone.zoneType))
    .sort((a, b) => a.number - b.number)
    .map((zone) => zone.location);
}

export function UserGuide(props: { snapshot: PackSnapshot }) {
  const { snapshot } = props;
  const route = entryRoute(snapshot);
  const monitored = snapshot.monitoring !== null;
  return (
    <PackPage snapshot={snapshot}>
      <SectionHeading kicker="Section 5" title="User guide" />
      <Text style={styles.paragraph}>
        Your alarm has three states. It is set when it is watching the whole building, part-set when
        it is watching only some of it (usually at night, while you are home), and unset when it is
        not watching for intruders at all. Hold-up buttons, 24-hour zones and tamper protection keep
        working even when it is unset.
      </Text>

      <Subheading>Setting the alarm when you go out</Subheading>
      <Bullets
        items={[
          'Close and lock every window and outside door. Check nobody, including pets, is left in a protected room.',
          'At the keypad, enter your code and choose full set. The exit tone starts.',
          'Leave straight away by your entry/exit route and close the door behind you. The tone stops when the system has set.',
          'If the tone changes or the keypad shows a fault, go back in, unset, and find out why before trying again.',
        ]}
      />

      <Subheading>Part-setting at night</Subheading>
      <Bullets
        items={[
          'Enter your code and choose part-set. Only the rooms chosen when the system was programmed are watched; the bedrooms and landing are normally left out.',
          'Remember which rooms are watched before going downstairs in the night.',
        ]}
      />

      <Subheading>Unsetting when you come home</Subheading>
      <Bullets
        items={[
          'Come in by the entry/exit route only. The entry tone reminds you the timer is running.',
          'Go straight to the keypad and enter your code before the timer runs out.',
          'If you ever come home to signs of a break-in, do not go in. Move somewhere safe and call the police on 999.',
        ]}
      />

      <Subheading>Your entry/exit route</Subheading>
      <Text style={styles.paragraph}>
        {route.length > 0
          ? `Going in and out while the system is set, keep to: ${route.join(', then ')}. Entering any other protected room before you unset starts a full alarm.`
          : 'No entry/exit route is programmed: the system is set and unset away from protected rooms.'}
      </Text>

      <View wrap={false}>
        <Subheading>If the alarm goes off by mistake</Subheading>
        <Bullets
          items={[
            'Unset the system at the keypad with your code.',
            monitored
              ? 'Stay by your phone. The monitoring centre may call; give them your password so they know it is you, and tell them it was a false alarm.'
              : 'Tell your neighbours and keyholders it was a false alarm.',
            'Do not set the system again until you know what caused it. If you cannot find the cause, call us.',
            'Write down the date, time and what you think caused it; the engineer will ask at the next visit.',
          ]}
        />
      </View>

      <View wrap={false}>
        <Subheading>Avoiding false alarms</Subheading>
        <Bullets
          items={[
            'Close doors and windows properly before setting; a door left ajar can trigger its contact, and a draught can move curtains or balloons in front of a detector.',
            'Keep heaters, fires and sunny windows out of a detector’s view, and do not move furniture or hang things in front of detectors.',
            'Keep pets out of protected rooms unless the system was designed for them.',
            'Keep spiders and insects away from detectors; a web across the lens can set one off.',
            'Keep the service visits: the standby battery and detectors wear out with age.',
            'Make sure everyone with a code knows how to use it, and ask us to show anyone new.',
          ]}
        />
      </View>

      <View wrap={false}>
        <Subheading>Who to call</Subheading>
        <Bullets
          items={[
            <Text key="installer">
              Faults, false alarms and help with the system: {snapshot.installer.name}, telephone{' '}
              <Mono>{snapshot.installer.phone}</Mono> or e-mail {snapshot.installer.email}
            </Text>,
            monitored
              ? `Alarms are watched by ${snapshot.monitoring?.centreName}; they call you and your keyholders, so keep your contact details up to date.`
              : 'Nobody is told automatically when the alarm sounds: make sure your keyholders know they may be called by neighbours.',
            'A break-in, or anyone in danger: the police on 999.',
          ]}
        />
      </View>
    </PackPage>
  );
}
