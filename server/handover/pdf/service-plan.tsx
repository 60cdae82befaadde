/** @jsxRuntime automatic */
import { Text, View } from '@react-pdf/renderer';
import type { PackSnapshot } from '../snapshot';
import { formatLongDate } from './format';
import { Field, Mono, Subheading } from './layout';
import { styles } from './styles';

export function ServicePlan(props: { snapshot: PackSnapshot }) {
  const { servicePlan, installer } = props.snapshot;
  return (
    <View wrap={false}>
      <Subheading>Service plan</Subheading>
      <Field name="Preventive visits">
        <Text>
          <Mono>{String(servicePlan.visitsPerYear)}</Mono>{' '}
          {servicePlan.visitsPerYear === 1 ? 'visit' : 'visits'} a year
        </Text>
      </Field>
      <Field name="Next visit due">{formatLongDate(servicePlan.nextVisitDue)}</Field>
      <Field name="Basis">{servicePlan.basis}</Field>
      <Text style={[styles.small, styles.muted, { marginTop: 3 }]}>
        {installer.name} will contact you before each visit. Each visit checks the battery, every
        detector, the sounders and the signalling, and ends with a report.
      </Text>
    </View>
  );
}
