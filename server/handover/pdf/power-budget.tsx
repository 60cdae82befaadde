/** @jsxRuntime automatic */
import { Text, View } from '@react-pdf/renderer';
import type { PackSnapshot } from '../snapshot';
import { ampHoursText, ampsText } from './format';
import { Field, Mono, PackPage, SectionHeading, StateWord, Subheading, Table } from './layout';
import { colours, styles } from './styles';

export function PowerBudget(props: { snapshot: PackSnapshot }) {
  const { snapshot } = props;
  const power = snapshot.power;
  return (
    <PackPage snapshot={snapshot}>
      <SectionHeading kicker="Section 3" title="Power budget" />
      <Text style={styles.paragraph}>
        The standby battery must run the whole system through a mains failure for the standby time,
        then sound the alarm, with a margin for the battery losing capacity as it ages.
      </Text>
      <View style={[styles.panel, { marginBottom: 10 }]}>
        <Text style={styles.label}>Formula</Text>
        <Text style={{ fontSize: 10, lineHeight: 1.35, fontWeight: 600 }}>
          Required Ah = (quiescent A × standby h + alarm A × alarm h) × ageing factor
        </Text>
      </View>
      {power.available ? (
        <>
          <Field name="Standby time">
            <Text>
              <Mono>{String(power.standbyHours)}</Mono> h
            </Text>
            <Text style={[styles.small, styles.muted]}>{power.standbySource}</Text>
          </Field>
          <Field name="Alarm time">
            <Text>
              <Mono>{String(power.alarmMinutes)}</Mono> min (
              <Mono>{String(Number((power.alarmMinutes / 60).toFixed(3)))}</Mono> h)
            </Text>
          </Field>
          <Field name="Quiescent current">
            <Text>
              <Mono>{String(power.quiescentMa)}</Mono> mA ={' '}
              <Mono>{ampsText(power.quiescentMa)}</Mono>
            </Text>
          </Field>
          <Field name="Alarm current">
            <Text>
              <Mono>{String(power.alarmMa)}</Mono> mA = <Mono>{ampsText(power.alarmMa)}</Mono>
            </Text>
          </Field>
          <Field name="Ageing factor">
            <Mono>{String(power.ageingFactor)}</Mono>
          </Field>
          <Field name="Working">
            <Mono style={{ fontSize: 8.5 }}>{power.working}</Mono>
          </Field>

          <View style={{ flexDirection: 'row', marginTop: 10 }} wrap={false}>
            <View style={[styles.card, { flex: 1, marginRight: 8 }]}>
              <Text style={styles.label}>Required capacity</Text>
              <Mono style={{ fontSize: 16, lineHeight: 1.25, fontWeight: 600 }}>
                {ampHoursText(power.requiredAh)}
              </Mono>
            </View>
            <View style={[styles.card, { flex: 1, marginRight: 8 }]}>
              <Text style={styles.label}>Fitted battery</Text>
              <Mono style={{ fontSize: 16, lineHeight: 1.25, fontWeight: 600 }}>
                {power.batteryAh === null ? 'not recorded' : ampHoursText(power.batteryAh)}
              </Mono>
            </View>
            <View style={[styles.card, { flex: 1.4 }]}>
              <Text style={styles.label}>Result</Text>
              {power.passes === null ? (
                <StateWord word="NOT ASSESSED" colour={colours.fault} size={16} />
              ) : power.passes ? (
                <StateWord word="PASS" colour={colours.normal} size={16} />
              ) : (
                <StateWord word="FAIL" colour={colours.alarm} size={16} />
              )}
              <Text style={styles.small}>
                {power.passes === null
                  ? 'The fitted battery’s capacity is not recorded.'
                  : power.passes
                    ? 'The fitted battery covers the required capacity.'
                    : 'The fitted battery is smaller than the required capacity.'}
              </Text>
            </View>
          </View>

          <Subheading>What draws current</Subheading>
          <Table
            columns={[
              { header: 'Item', weight: 4 },
              { header: 'Quiescent mA', weight: 1.3, align: 'right' },
              { header: 'Alarm mA', weight: 1.3, align: 'right' },
            ]}
            rows={[
              ...power.items.map((item, index) => ({
                key: index,
                cells: [
                  item.label,
                  <Mono key="q">{String(item.quiescentMa)}</Mono>,
                  <Mono key="a">{String(item.alarmMa)}</Mono>,
                ],
              })),
              {
                key: 'total',
                cells: [
                  <Text key="label" style={styles.bold}>
                    Total
                  </Text>,
                  <Mono key="q" style={styles.bold}>
                    {String(power.quiescentMa)}
                  </Mono>,
                  <Mono key="a" style={styles.bold}>
                    {String(power.alarmMa)}
                  </Mono>,
                ],
              },
            ]}
          />
        </>
      ) : (
        <View style={styles.card}>
          <Text style={styles.label}>Not available</Text>
          <Text>The power budget could not be worked out: {power.reason}</Text>
        </View>
      )}
    </PackPage>
  );
}
