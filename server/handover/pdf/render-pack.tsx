/** @jsxRuntime automatic */
// The pragma above (in every .tsx here): `tsx` reads the root tsconfig.json, which sets no
// "jsx" option, and would otherwise compile JSX to React.createElement calls.
import { Document, renderToBuffer } from '@react-pdf/renderer';
import type { PackSnapshot } from '../snapshot';
import { Certificate } from './certificate';
import { Cover } from './cover';
import { registerPackFonts } from './fonts';
import { verifyQrCode } from './images';
import { People } from './people';
import { PowerBudget } from './power-budget';
import { Safety } from './safety';
import { SignOff } from './sign-off';
import { UserGuide } from './user-guide';
import { ZoneSchedule } from './zone-schedule';

export function HandoverPack(props: { snapshot: PackSnapshot; qrDataUrl: string }) {
  const { snapshot } = props;
  // The issue time stands in for "now", so the same snapshot always renders the same file.
  const issued = new Date(snapshot.issuedAt);
  return (
    <Document
      title={`Handover pack ${snapshot.packNumber} — ${snapshot.site.name}`}
      author={snapshot.installer.name}
      subject={`Intruder alarm handover pack, revision ${snapshot.revision}${snapshot.preview ? ' (preview, not issued)' : ''}`}
      creator="Wardbook"
      producer="Wardbook"
      language="en-GB"
      creationDate={issued}
      modificationDate={issued}
    >
      <Cover snapshot={snapshot} qrDataUrl={props.qrDataUrl} />
      <Certificate snapshot={snapshot} />
      <ZoneSchedule snapshot={snapshot} />
      <PowerBudget snapshot={snapshot} />
      <People snapshot={snapshot} />
      <UserGuide snapshot={snapshot} />
      <Safety snapshot={snapshot} />
      <SignOff snapshot={snapshot} />
    </Document>
  );
}

/** Renders a handover pack from its frozen snapshot: the snapshot is the only input. */
export async function renderPackPdf(snapshot: PackSnapshot): Promise<Buffer> {
  registerPackFonts();
  const qrDataUrl = await verifyQrCode(snapshot.verifyUrl);
  return renderToBuffer(<HandoverPack snapshot={snapshot} qrDataUrl={qrDataUrl} />);
}
