import type { SiteFile } from '@server/files/schema';
import { Paperclip } from 'lucide-react';
import { useState } from 'react';

import { Card } from '@/components/ui/card';
import { LiveMessage } from '@/components/ui/live-message';
import { useSiteFiles } from '@/features/files/api/get-site-files';
import { FileUploadForm } from '@/features/files/components/file-upload-form';
import { downloadLinkId } from '@/features/files/components/file-kinds';
import { SiteFileItem } from '@/features/files/components/site-file-item';
import { useFocusAfterRender } from '@/lib/use-focus-after-render';

/** Installer staff may delete any file; a homeowner only what they uploaded themselves. */
export type FilesViewer =
  { role: 'engineer' | 'office' } | { role: 'homeowner'; displayName: string };

type FilesPanelProps = { siteId: string; viewer: FilesViewer };

function canDelete(viewer: FilesViewer, file: SiteFile): boolean {
  if (viewer.role === 'engineer' || viewer.role === 'office') return true;
  // The API names the uploader rather than giving an id, so this only decides whether to offer
  // the button; the API itself checks who uploaded the file.
  return viewer.role === 'homeowner' && file.uploadedBy === viewer.displayName;
}

/** Photos and documents kept with the site: previews, downloads and a new upload. */
export function FilesPanel({ siteId, viewer }: FilesPanelProps) {
  const { data: files } = useSiteFiles(siteId);
  const [message, setMessage] = useState('');
  const focusAfterRender = useFocusAfterRender();

  return (
    <Card title="Photos and documents" icon={Paperclip} flush>
      {files.length > 0 ? (
        <ul aria-label="Files" className="divide-y divide-hairline">
          {files.map((file, index) => (
            <SiteFileItem
              key={file.id}
              siteId={siteId}
              file={file}
              canDelete={canDelete(viewer, file)}
              onDeleted={(deleted) => {
                setMessage(`${deleted.fileName} was deleted.`);
                // Carry on from the neighbouring file rather than the top of the page.
                const neighbours = [files[index + 1], files[index - 1]].filter(
                  (neighbour): neighbour is SiteFile => neighbour !== undefined,
                );
                focusAfterRender(...neighbours.map((neighbour) => downloadLinkId(neighbour)));
              }}
            />
          ))}
        </ul>
      ) : (
        <p className="px-4 py-4 text-ink-muted md:px-5">No photos or documents yet.</p>
      )}
      <div className="border-t border-hairline bg-paper px-4 py-5 md:px-5">
        <FileUploadForm
          siteId={siteId}
          onUploaded={(uploaded) => setMessage(`${uploaded.fileName} was uploaded.`)}
        />
      </div>
      <LiveMessage message={message} />
    </Card>
  );
}
