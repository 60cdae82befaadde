import { useState } from 'react';
import { Download, ExternalLink, Eye, EyeOff, FileSearch, RotateCw } from 'lucide-react';

import { Button } from '@/components/ui/button';
import { buttonClassName } from '@/components/ui/button-styles';

type PackPreviewProps = {
  /** The PDF, served inline. */
  previewUrl: string;
  /** Names the document in the frame's title and the links: "the handover pack". */
  documentName?: string;
  headingLevel?: 2 | 3;
};

/**
 * The pack as it would be issued now. On a wide screen it can open in the page; on a phone it
 * opens in the phone's own PDF viewer, which reads far better than a frame the width of a thumb.
 * Built on request, because drawing a whole pack takes the server a moment.
 */
export function PackPreview({
  previewUrl,
  documentName = 'the handover pack',
  headingLevel = 2,
}: PackPreviewProps) {
  const [isShown, setIsShown] = useState(false);
  // A new frame asks the server for a fresh drawing from the record as it is now.
  const [loadCount, setLoadCount] = useState(0);
  const Heading = headingLevel === 2 ? 'h2' : 'h3';

  return (
    <section aria-labelledby="pack-preview-heading" className="grid gap-3">
      <Heading
        id="pack-preview-heading"
        className={
          headingLevel === 2
            ? 'flex items-center gap-2 text-xl font-semibold'
            : 'flex items-center gap-2 text-lg font-semibold'
        }
      >
        <FileSearch aria-hidden="true" className="size-6 shrink-0" />
        Preview the pack
      </Heading>
      <p className="max-w-prose text-sm text-ink-muted">
        The preview is drawn from the record as it stands now. It has no pack number and no seal:
        only an issued pack has those.
      </p>
      <div className="flex flex-wrap gap-2">
        <a
          href={previewUrl}
          target="_blank"
          rel="noopener"
          className={buttonClassName({ variant: 'secondary', size: 'lg' })}
        >
          <ExternalLink aria-hidden="true" className="size-5" />
          Open the preview
          <span className="sr-only"> of {documentName} (PDF, opens in a new tab)</span>
        </a>
        {/* Only wide screens get the preview in the page. */}
        <div className="hidden flex-wrap gap-2 md:flex">
          <Button
            variant="secondary"
            size="lg"
            aria-expanded={isShown}
            onClick={() => setIsShown((shown) => !shown)}
          >
            {isShown ? (
              <EyeOff aria-hidden="true" className="size-5" />
            ) : (
              <Eye aria-hidden="true" className="size-5" />
            )}
            {isShown ? 'Hide the preview' : 'Show the preview here'}
          </Button>
          {isShown ? (
            <Button
              variant="secondary"
              size="lg"
              onClick={() => setLoadCount((count) => count + 1)}
            >
              <RotateCw aria-hidden="true" className="size-5" />
              Redraw the preview
            </Button>
          ) : null}
        </div>
      </div>
      {isShown ? (
        <div className="hidden gap-2 md:grid">
          <iframe
            key={loadCount}
            src={previewUrl}
            title={`Preview of ${documentName} (PDF)`}
            className="h-[80vh] w-full rounded-md border border-hairline bg-white"
          />
          <p className="text-sm text-ink-muted">
            If the preview does not appear, your browser may not show PDFs in a page:{' '}
            <a href={previewUrl} download className="inline-flex items-center gap-1 font-semibold">
              <Download aria-hidden="true" className="size-4" />
              download the preview
            </a>{' '}
            instead.
          </p>
        </div>
      ) : null}
    </section>
  );
}
