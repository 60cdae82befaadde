import type { SiteFile } from '@server/files/schema';
import { Download, ExternalLink, FileText } from 'lucide-react';

import { buttonClassName } from '@/components/ui/button-styles';
import { ConfirmButton } from '@/components/ui/confirm-button';
import { ProblemAlert } from '@/components/ui/problem-alert';
import { useDeleteSiteFile } from '@/features/files/api/delete-site-file';
import { siteFileContentUrl } from '@/features/files/api/get-site-files';
import { downloadLinkId, FILE_TYPE_LABELS, isImage } from '@/features/files/components/file-kinds';
import { formatFileSize } from '@/lib/file-size';
import { formatDateTime } from '@/utils/format';

type SiteFileItemProps = {
  siteId: string;
  file: SiteFile;
  canDelete: boolean;
  onDeleted: (file: SiteFile) => void;
};

export function SiteFileItem({ siteId, file, canDelete, onDeleted }: SiteFileItemProps) {
  const deleteFile = useDeleteSiteFile({ mutationConfig: { onSuccess: () => onDeleted(file) } });
  const downloadUrl = siteFileContentUrl(siteId, file.id);
  const inlineUrl = siteFileContentUrl(siteId, file.id, { inline: true });

  return (
    <li className="grid gap-3 px-4 py-4 sm:grid-cols-[6rem_minmax(0,1fr)] md:px-5">
      <div className="flex size-24 items-center justify-center overflow-hidden rounded-md border border-hairline bg-paper">
        {isImage(file.contentType) ? (
          // The name and description beside it say what it is, so the preview is decorative.
          <img
            src={inlineUrl}
            alt=""
            loading="lazy"
            decoding="async"
            className="size-full object-cover"
          />
        ) : (
          <FileText aria-hidden="true" className="size-10 text-ink-muted" />
        )}
      </div>
      <div className="grid min-w-0 gap-2">
        <h3 className="font-semibold break-words">{file.fileName}</h3>
        {file.description ? <p>{file.description}</p> : null}
        <p className="text-sm text-ink-muted">
          {FILE_TYPE_LABELS[file.contentType]} ·{' '}
          <span className="font-mono">{formatFileSize(file.sizeBytes)}</span> · Uploaded by{' '}
          {file.uploadedBy ?? 'someone no longer in Wardbook'},{' '}
          <time dateTime={file.uploadedAt}>{formatDateTime(file.uploadedAt)}</time>
        </p>
        {deleteFile.isError ? <ProblemAlert error={deleteFile.error} /> : null}
        <div className="flex flex-wrap gap-2">
          <a
            id={downloadLinkId(file)}
            href={downloadUrl}
            download
            className={buttonClassName({ variant: 'secondary', size: 'lg' })}
          >
            <Download aria-hidden="true" className="size-5" />
            Download <span className="sr-only">{file.fileName}</span>
          </a>
          {isImage(file.contentType) ? (
            <a
              href={inlineUrl}
              target="_blank"
              rel="noopener"
              className={buttonClassName({ variant: 'secondary', size: 'lg' })}
            >
              <ExternalLink aria-hidden="true" className="size-5" />
              View <span className="sr-only">{file.fileName} full size (opens in a new tab)</span>
            </a>
          ) : null}
          {canDelete ? (
            <ConfirmButton
              size="lg"
              question={`Delete ${file.fileName}? It cannot be brought back.`}
              confirmLabel="Yes, delete it"
              cancelLabel="Keep it"
              pending={deleteFile.isPending}
              onConfirm={() => deleteFile.mutate({ siteId, fileId: file.id })}
            >
              Delete <span className="sr-only">{file.fileName}</span>
            </ConfirmButton>
          ) : null}
        </div>
      </div>
    </li>
  );
}
