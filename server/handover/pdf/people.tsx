/** @jsxRuntime automatic */
import { Text, View } from '@react-pdf/renderer';
import type { PackSnapshot } from '../snapshot';
import { accessLevelText } from './format';
import { Field, Mono, PackPage, SectionHeading, Subheading, Table } from './layout';
import { ServicePlan } from './service-plan';
import { colours, styles } from './styles';

export const NO_CODES_STATEMENT =
  'No user codes are recorded in this pack or in Wardbook. Each holder chooses and changes their own code at the keypad; never write it down near the system or send it by e-mail or text message.';

function Keyholders(props: { snapshot: PackSnapshot }) {
  const keyholders = [...props.snapshot.keyholders].sort((a, b) => a.position - b.position);
  return (
    <>
      <Subheading>Keyholders and call order</Subheading>
      <Text style={styles.paragraph}>
        When the alarm needs someone to attend, keyholders are called in this order until one can
        go. A keyholder must be reachable by phone and able to reach the premises promptly
        {props.snapshot.monitoring ? ' (the monitoring centre will ask how quickly)' : ''}.
      </Text>
      <Table
        columns={[
          { header: 'Call order', weight: 0.8 },
          { header: 'Keyholder', weight: 2.5 },
          { header: 'Telephone', weight: 1.8 },
          { header: 'Can attend within', weight: 1.4 },
        ]}
        rows={keyholders.map((keyholder) => ({
          key: keyholder.position,
          cells: [
            <Mono key="position" style={styles.bold}>
              {String(keyholder.position)}
            </Mono>,
            keyholder.name,
            <Mono key="phone">{keyholder.phone}</Mono>,
            keyholder.attendMinutes === null ? 'Not stated' : `${keyholder.attendMinutes} minutes`,
          ],
        }))}
        empty="No keyholders named. Name at least two before the system is monitored."
      />
    </>
  );
}

function UserSlots(props: { snapshot: PackSnapshot }) {
  const slots = [...props.snapshot.userSlots].sort((a, b) => a.slot - b.slot);
  return (
    <>
      <Subheading>User-code slots</Subheading>
      <Table
        columns={[
          { header: 'Slot', weight: 0.6 },
          { header: 'Holder', weight: 3 },
          { header: 'Access level (EN 50131)', weight: 1.8 },
        ]}
        rows={slots.map((slot) => ({
          key: slot.slot,
          cells: [
            <Mono key="slot">{String(slot.slot)}</Mono>,
            slot.holder,
            accessLevelText(slot.level),
          ],
        }))}
        empty="No user-code slots recorded."
      />
      <View
        style={[styles.panel, { borderLeftWidth: 3, borderLeftColor: colours.info }]}
        wrap={false}
      >
        <Text style={{ fontWeight: 600 }}>{NO_CODES_STATEMENT}</Text>
      </View>
    </>
  );
}

function Monitoring(props: { snapshot: PackSnapshot }) {
  const { monitoring, system } = props.snapshot;
  return (
    <>
      <Subheading>Monitoring and police response</Subheading>
      {monitoring ? (
        <View wrap={false}>
          <Field name="Monitoring centre">{monitoring.centreName}</Field>
          <Field name="Account number">
            <Mono>{monitoring.accountNumber ?? 'not yet assigned'}</Mono>
          </Field>
          <Field name="Police URN">
            <Mono>{monitoring.policeUrn ?? 'none'}</Mono>
          </Field>
          <Field name="URN status">{monitoring.urnStatus}</Field>
          <Text style={[styles.small, styles.muted, { marginTop: 3 }]}>
            Police response depends on the URN. Under NPCC policy, false alarms are counted over a
            rolling twelve months: two bring a warning and three can withdraw police response.
          </Text>
        </View>
      ) : (
        <Text>
          This system is not monitored by a monitoring centre. When it sounds, nobody is told
          automatically: neighbours and keyholders must respond.
        </Text>
      )}

      <Subheading>Signalling paths</Subheading>
      <Table
        columns={[
          { header: 'Path', weight: 0.6 },
          { header: 'Bearer', weight: 1.6 },
          { header: 'ATS category', weight: 1.2 },
          { header: 'Description', weight: 3.4 },
        ]}
        rows={system.signallingPaths.map((path, index) => ({
          key: index,
          cells: [
            <Mono key="n">{String(index + 1)}</Mono>,
            path.bearer,
            <Mono key="ats">{path.atsCategory}</Mono>,
            path.description,
          ],
        }))}
        empty="No signalling paths: the system is audible-only."
      />
    </>
  );
}

export function People(props: { snapshot: PackSnapshot }) {
  return (
    <PackPage snapshot={props.snapshot}>
      <SectionHeading kicker="Section 4" title="People, monitoring and service" />
      <Keyholders snapshot={props.snapshot} />
      <UserSlots snapshot={props.snapshot} />
      <Monitoring snapshot={props.snapshot} />
      <ServicePlan snapshot={props.snapshot} />
    </PackPage>
  );
}
