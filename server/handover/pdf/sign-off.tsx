/** @jsxRuntime automatic */
import { Image, Text, View } from '@react-pdf/renderer';
import type { PackSnapshot, SnapshotSignature } from '../snapshot';
import { breakUrl, formatLongDate } from './format';
import { signatureImage } from './images';
import { Mono, PackPage, SectionHeading } from './layout';
import { colours, styles } from './styles';

function SignatureBox(props: { role: string; signature: SnapshotSignature | null }) {
  const { signature } = props;
  return (
    <View style={styles.card} wrap={false}>
      <Text style={styles.label}>{props.role}</Text>
      <View
        style={{
          height: 78,
          borderBottomWidth: 0.75,
          borderBottomColor: colours.ink,
          justifyContent: 'flex-end',
          marginBottom: 6,
        }}
      >
        {signature ? (
          <Image
            src={signatureImage(signature.image)}
            style={{ height: 70, objectFit: 'contain' }}
          />
        ) : (
          <Text style={[styles.small, styles.muted, { marginBottom: 3 }]}>Signature</Text>
        )}
      </View>
      <Text>
        <Text style={styles.muted}>Name </Text>
        {signature ? signature.name : ''}
      </Text>
      <Text style={{ marginTop: 3 }}>
        <Text style={styles.muted}>Date </Text>
        {signature ? formatLongDate(signature.signedAt) : ''}
      </Text>
    </View>
  );
}

export function SignOff(props: { snapshot: PackSnapshot }) {
  const { snapshot } = props;
  const variations = snapshot.variations.length;
  return (
    <PackPage snapshot={snapshot}>
      <SectionHeading kicker="Section 7" title="Sign-off" />
      <Text style={styles.paragraph}>
        The engineer confirms that the system was installed, commissioned and tested as recorded in
        this pack.
      </Text>
      <Text style={styles.paragraph}>
        The customer confirms that they received this pack, were shown how to set, part-set and
        unset the system and what to do after a false alarm, and{' '}
        {variations === 0
          ? 'that no variations from the pre-issue checks were needed.'
          : `accepted the ${variations === 1 ? 'variation' : `${variations} variations`} listed on the completion certificate.`}
      </Text>
      <View style={{ flexDirection: 'row', marginTop: 14 }}>
        <View style={{ flex: 1, marginRight: 12 }}>
          <SignatureBox role="Engineer" signature={snapshot.engineer} />
        </View>
        <View style={{ flex: 1 }}>
          <SignatureBox role="Customer" signature={snapshot.customer} />
        </View>
      </View>
      <View style={[styles.panel, { marginTop: 18 }]} wrap={false}>
        <Text style={styles.label}>Sealed record</Text>
        <Text>
          When issued, this pack is fixed: its fingerprint is sealed with {snapshot.installer.name}
          ’s signature and kept. Corrections are issued as a new revision that replaces this one;
          this pack is never edited. Anyone can check a copy at:
        </Text>
        <View style={{ marginTop: 3 }}>
          {breakUrl(snapshot.verifyUrl, 90).map((line, index) => (
            <Mono key={index}>{line}</Mono>
          ))}
        </View>
      </View>
    </PackPage>
  );
}
