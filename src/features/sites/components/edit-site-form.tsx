import { useState } from 'react';
import { zodResolver } from '@hookform/resolvers/zod';
import { FormProvider, useForm } from 'react-hook-form';
import type { z } from 'zod';

import { siteConsistencyProblems, updateSiteSchema, type SiteDetail } from '@server/sites/schema';
import { SaveRow } from '@/components/forms/save-row';
import { FormProblem } from '@/components/ui/form-problem';
import { useSite } from '@/features/sites/api/get-site';
import { useUpdateSite } from '@/features/sites/api/update-site';
import { SiteFields } from '@/features/sites/components/site-fields';
import { SITE_FIELD_NAMES } from '@/features/sites/utils/site-field-names';
import { applyServerFieldErrors, countFieldErrors } from '@/lib/form-errors';
import { useReloadLatest } from '@/lib/use-reload-latest';
import { useShowNewerSavedVersion } from '@/lib/use-show-newer-saved-version';
import { useUnsavedChangesGuard } from '@/lib/use-unsaved-changes-guard';

// The form always sends every field, so the whole record can be checked as it will be saved.
const editSiteSchema = updateSiteSchema.superRefine((site, context) => {
  for (const problem of siteConsistencyProblems(site)) {
    context.addIssue({ code: 'custom', ...problem });
  }
});
type EditSiteFormValues = z.input<typeof editSiteSchema>;

function toFormValues(site: SiteDetail): EditSiteFormValues {
  return {
    name: site.name,
    premisesType: site.premisesType,
    addressLine1: site.addressLine1,
    addressLine2: site.addressLine2,
    town: site.town,
    postcode: site.postcode,
    accessNotes: site.accessNotes,
    hazards: site.hazards,
    riskNotes: site.riskNotes,
    requiredGrade: site.requiredGrade,
    gradeRationale: site.gradeRationale,
    environmentalClass: site.environmentalClass,
    policeUrn: site.policeUrn,
    urnStatus: site.urnStatus,
    monitoringCentreId: site.monitoringCentre?.id ?? null,
    monitoringAccount: site.monitoringAccount,
    version: site.version,
  };
}

export function EditSiteForm({ siteId }: { siteId: string }) {
  const site = useSite(siteId);
  const [unplacedMessages, setUnplacedMessages] = useState<string[]>([]);
  const [savedMessage, setSavedMessage] = useState('');
  const form = useForm<EditSiteFormValues, unknown, z.output<typeof editSiteSchema>>({
    resolver: zodResolver(editSiteSchema),
    defaultValues: toFormValues(site.data),
  });
  const { isDirty } = form.formState;

  useShowNewerSavedVersion({
    form,
    versionField: 'version',
    saved: site.data,
    savedVersion: site.data.version,
    toFormValues,
  });

  const updateSite = useUpdateSite({
    onSuccess: (saved) => {
      form.reset(toFormValues(saved));
      setSavedMessage('Site details saved.');
    },
    onError: (error) =>
      setUnplacedMessages(
        applyServerFieldErrors(error, form.setError, (field) => SITE_FIELD_NAMES.includes(field)),
      ),
  });

  useUnsavedChangesGuard(isDirty && !updateSite.isPending);

  const submit = form.handleSubmit((values) => {
    setUnplacedMessages([]);
    setSavedMessage('');
    updateSite.mutate({ siteId, values });
  });

  const { isReloading, reloadLatest } = useReloadLatest(async () => {
    const latest = await site.refetch();
    if (latest.data) {
      form.reset(toFormValues(latest.data));
      updateSite.reset();
      setSavedMessage('Showing the latest saved details.');
    }
  });

  return (
    <FormProvider {...form}>
      <form noValidate onSubmit={submit} className="grid gap-6">
        <FormProblem
          key={form.formState.submitCount}
          subject="The site record"
          fieldErrorCount={countFieldErrors(form.formState.errors)}
          error={updateSite.error}
          unplacedMessages={unplacedMessages}
          onReloadLatest={reloadLatest}
          isReloading={isReloading}
        />
        <SiteFields
          idPrefix={`site-${siteId}`}
          currentMonitoringCentre={site.data.monitoringCentre}
          headingLevel={3}
        />
        <SaveRow
          saveLabel="Save site details"
          isSaving={updateSite.isPending}
          savedMessage={isDirty ? '' : savedMessage}
        />
      </form>
    </FormProvider>
  );
}
