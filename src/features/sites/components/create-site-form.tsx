import { useState } from 'react';
import { zodResolver } from '@hookform/resolvers/zod';
import { FormProvider, useForm } from 'react-hook-form';
import { Link, useNavigate } from 'react-router-dom';
import type { z } from 'zod';

import { SubmitButton } from '@/components/forms/submit-button';
import { buttonClassName } from '@/components/ui/button-styles';
import { FormProblem } from '@/components/ui/form-problem';
import { paths, type SiteRole } from '@/config/paths';
import { createSiteSchema, useCreateSite } from '@/features/sites/api/create-site';
import { SiteFields } from '@/features/sites/components/site-fields';
import { SITE_FIELD_NAMES } from '@/features/sites/utils/site-field-names';
import { applyServerFieldErrors, countFieldErrors } from '@/lib/form-errors';

type CreateSiteFormValues = z.input<typeof createSiteSchema>;

const blankSite: Partial<CreateSiteFormValues> = {
  name: '',
  addressLine1: '',
  addressLine2: '',
  town: '',
  postcode: '',
  accessNotes: '',
  hazards: '',
  riskNotes: '',
  gradeRationale: '',
  policeUrn: null,
  urnStatus: 'none',
  monitoringCentreId: null,
  monitoringAccount: null,
};

export function CreateSiteForm({ role }: { role: SiteRole }) {
  const navigate = useNavigate();
  const [unplacedMessages, setUnplacedMessages] = useState<string[]>([]);
  const form = useForm<CreateSiteFormValues, unknown, z.output<typeof createSiteSchema>>({
    resolver: zodResolver(createSiteSchema),
    defaultValues: blankSite,
  });
  const createSite = useCreateSite({
    onSuccess: (site) => navigate(paths.sites.workspace.getHref(role, site.id)),
    onError: (error) =>
      setUnplacedMessages(
        applyServerFieldErrors(error, form.setError, (field) => SITE_FIELD_NAMES.includes(field)),
      ),
  });

  const submit = form.handleSubmit((values) => {
    setUnplacedMessages([]);
    createSite.mutate(values);
  });

  return (
    <FormProvider {...form}>
      <form noValidate onSubmit={submit} className="grid gap-6">
        <FormProblem
          key={form.formState.submitCount}
          subject="The new site"
          fieldErrorCount={countFieldErrors(form.formState.errors)}
          error={createSite.error}
          unplacedMessages={unplacedMessages}
        />
        <SiteFields idPrefix="new-site" />
        <div className="flex flex-wrap items-center gap-3">
          <SubmitButton
            label="Create site"
            pendingLabel="Creating site…"
            isPending={createSite.isPending}
          />
          <Link
            to={paths.sites.list.getHref(role)}
            className={buttonClassName({ variant: 'secondary' })}
          >
            Cancel
          </Link>
        </div>
      </form>
    </FormProvider>
  );
}
