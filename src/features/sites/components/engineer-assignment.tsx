import { useState, type FormEvent } from 'react';
import { UserCog } from 'lucide-react';

import type { SiteDetail } from '@server/sites/schema';
import { describeError } from '@/components/errors/describe-error';
import { SaveRow } from '@/components/forms/save-row';
import { Card } from '@/components/ui/card';
import { checkboxClassName } from '@/components/ui/form-styles';
import { LoadingStatus } from '@/components/ui/loading-status';
import { Notice } from '@/components/ui/notice';
import { useAssignEngineers } from '@/features/sites/api/assign-engineers';
import { useEngineerChoices } from '@/features/sites/api/get-engineer-choices';

/** The office chooses which of the company's engineers look after this site. */
export function EngineerAssignment({ site }: { site: SiteDetail }) {
  const choices = useEngineerChoices('office', site.installer.id);
  const [selectedIds, setSelectedIds] = useState<string[]>(() =>
    site.engineers.map((engineer) => engineer.id),
  );
  const [savedMessage, setSavedMessage] = useState('');
  const assignEngineers = useAssignEngineers({
    onSuccess: (saved) => {
      setSelectedIds(saved.engineers.map((engineer) => engineer.id));
      setSavedMessage(
        saved.engineers.length === 0
          ? 'Saved: no engineers are assigned.'
          : `Saved: ${saved.engineers.map((engineer) => engineer.displayName).join(', ')}.`,
      );
    },
  });

  const toggle = (userId: string, checked: boolean) => {
    setSavedMessage('');
    setSelectedIds((current) =>
      checked ? [...current, userId] : current.filter((id) => id !== userId),
    );
  };

  const submit = (event: FormEvent) => {
    event.preventDefault();
    assignEngineers.mutate({ siteId: site.id, userIds: selectedIds });
  };

  // Someone assigned earlier may have left the company's list; keep them visible to untick.
  const listed = choices.data ?? [];
  const unlisted = site.engineers.filter(
    (engineer) => !listed.some((choice) => choice.id === engineer.id),
  );
  const options = [...listed, ...unlisted];

  return (
    <Card title="Assigned engineers" icon={UserCog}>
      {choices.isPending ? (
        <LoadingStatus label="Loading engineers" />
      ) : (
        <form onSubmit={submit} className="grid gap-4">
          {choices.isError ? (
            <Notice tone="fault" title="The company's engineers could not be loaded">
              {describeError(choices.error).message}
            </Notice>
          ) : null}
          <fieldset>
            <legend className="mb-2 text-sm text-ink-muted">
              Engineers who look after this site. Every engineer in the company can still open it.
            </legend>
            {options.length === 0 ? (
              <p className="text-sm">The company has no engineers in Wardbook yet.</p>
            ) : (
              <ul className="grid gap-1">
                {options.map((engineer) => (
                  <li key={engineer.id}>
                    <label className="flex min-h-10 cursor-pointer items-center gap-3 rounded-md px-2 hover:bg-paper">
                      <input
                        type="checkbox"
                        className={checkboxClassName}
                        checked={selectedIds.includes(engineer.id)}
                        onChange={(event) => toggle(engineer.id, event.target.checked)}
                      />
                      <span>{engineer.displayName}</span>
                    </label>
                  </li>
                ))}
              </ul>
            )}
          </fieldset>
          {assignEngineers.isError ? (
            <div role="alert">
              <Notice tone="alarm" title="The engineers were not saved">
                {describeError(assignEngineers.error).message}
              </Notice>
            </div>
          ) : null}
          <SaveRow
            saveLabel="Save engineers"
            isSaving={assignEngineers.isPending}
            savedMessage={savedMessage}
            variant="secondary"
          />
        </form>
      )}
    </Card>
  );
}
