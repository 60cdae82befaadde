import type { ReactNode } from 'react';
import { Controller, useFormContext, useWatch } from 'react-hook-form';

import { GRADES, ROMAN_CLASSES } from '@server/schema/fields';
import { PREMISES_TYPES, URN_STATUSES } from '@server/sites/schema';
import { Card } from '@/components/ui/card';
import { FieldErrorMessage, FormField } from '@/components/ui/form-field';
import { checkboxClassName, inputClassName, selectClassName } from '@/components/ui/form-styles';
import { useMonitoringCentres } from '@/features/sites/api/get-monitoring-centres';
import {
  PREMISES_TYPE_LABELS,
  URN_STATUS_HINTS,
  URN_STATUS_LABELS,
} from '@/features/sites/utils/labels';
import type { SiteFieldValues } from '@/features/sites/utils/site-field-names';
import { ENVIRONMENTAL_CLASS_SUMMARIES, GRADE_SUMMARIES } from '@/lib/en50131';
import { numberOrUndefined, textOrNull } from '@/lib/form-values';

function FieldGrid({ children }: { children: ReactNode }) {
  return <div className="grid gap-x-5 gap-y-4 md:grid-cols-2">{children}</div>;
}

function ChoiceGroup({
  legend,
  error,
  errorId,
  children,
}: {
  legend: string;
  error?: string;
  errorId: string;
  children: ReactNode;
}) {
  return (
    <fieldset className="min-w-0 md:col-span-2" aria-describedby={error ? errorId : undefined}>
      <legend className="mb-1 text-sm font-medium">{legend}</legend>
      <div className="grid gap-2 sm:grid-cols-2">{children}</div>
      <FieldErrorMessage id={errorId} message={error} />
    </fieldset>
  );
}

const choiceClassName =
  'flex min-h-11 cursor-pointer items-start gap-3 rounded-md border border-hairline bg-white px-3 py-2 ' +
  'has-[:checked]:border-ink has-[:checked]:bg-paper has-[:focus-visible]:outline-3 has-[:focus-visible]:outline-ink';

/**
 * Everything recorded about the site itself: address, risk and grade, access, police response
 * and monitoring. Used inside a FormProvider by the create and edit forms.
 */
type SiteFieldsProps = {
  idPrefix: string;
  /** The centre already on record, offered even if it no longer appears in the list. */
  currentMonitoringCentre?: { id: string; name: string } | null;
  /** 3 when the form sits under a section heading of its own. */
  headingLevel?: 2 | 3;
};

export function SiteFields({
  idPrefix,
  currentMonitoringCentre,
  headingLevel = 2,
}: SiteFieldsProps) {
  const {
    register,
    control,
    setValue,
    formState: { errors },
  } = useFormContext<SiteFieldValues>();
  const monitoringCentres = useMonitoringCentres();
  const monitoringCentreId = useWatch({ control, name: 'monitoringCentreId' });
  const urnStatus = useWatch({ control, name: 'urnStatus' });
  const listedCentres = monitoringCentres.data ?? [];
  const centreChoices =
    currentMonitoringCentre && !listedCentres.some(({ id }) => id === currentMonitoringCentre.id)
      ? [currentMonitoringCentre, ...listedCentres]
      : listedCentres;

  return (
    <div className="grid gap-6">
      <Card title="Site" headingLevel={headingLevel}>
        <FieldGrid>
          <FormField label="Site name" error={errors.name?.message} className="md:col-span-2">
            {(field) => (
              <input
                {...field}
                {...register('name')}
                className={inputClassName()}
                autoComplete="off"
              />
            )}
          </FormField>
          <ChoiceGroup
            legend="Premises type"
            error={errors.premisesType?.message}
            errorId={`${idPrefix}-premises-error`}
          >
            {PREMISES_TYPES.map((type) => (
              <label key={type} className={choiceClassName}>
                <input
                  type="radio"
                  value={type}
                  {...register('premisesType')}
                  className={`${checkboxClassName} mt-0.5`}
                />
                <span className="font-medium">{PREMISES_TYPE_LABELS[type]}</span>
              </label>
            ))}
          </ChoiceGroup>
        </FieldGrid>
      </Card>

      <Card title="Address" headingLevel={headingLevel}>
        <FieldGrid>
          <FormField label="Address line 1" error={errors.addressLine1?.message}>
            {(field) => (
              <input
                {...field}
                {...register('addressLine1')}
                className={inputClassName()}
                autoComplete="off"
              />
            )}
          </FormField>
          <FormField label="Address line 2" optional error={errors.addressLine2?.message}>
            {(field) => (
              <input
                {...field}
                {...register('addressLine2')}
                className={inputClassName()}
                autoComplete="off"
              />
            )}
          </FormField>
          <FormField label="Town" error={errors.town?.message}>
            {(field) => (
              <input
                {...field}
                {...register('town')}
                className={inputClassName()}
                autoComplete="off"
              />
            )}
          </FormField>
          <FormField label="Postcode" hint="A UK postcode." error={errors.postcode?.message}>
            {(field) => (
              <input
                {...field}
                {...register('postcode')}
                className={inputClassName({ className: 'max-w-40 uppercase' })}
                autoComplete="off"
                spellCheck={false}
              />
            )}
          </FormField>
        </FieldGrid>
      </Card>

      <Card title="Grade and risk" headingLevel={headingLevel}>
        <FieldGrid>
          <Controller
            control={control}
            name="requiredGrade"
            render={({ field, fieldState }) => (
              <ChoiceGroup
                legend="Security grade (EN 50131-1)"
                error={fieldState.error?.message}
                errorId={`${idPrefix}-grade-error`}
              >
                {GRADES.map((grade) => (
                  <label key={grade} className={choiceClassName}>
                    <input
                      type="radio"
                      name={field.name}
                      value={grade}
                      checked={field.value === grade}
                      onChange={() => field.onChange(grade)}
                      onBlur={field.onBlur}
                      ref={grade === GRADES[0] ? field.ref : undefined}
                      aria-describedby={`${idPrefix}-grade-${grade}-summary`}
                      className={`${checkboxClassName} mt-1`}
                    />
                    <span>
                      <span className="block font-medium">Grade {grade}</span>
                      <span
                        id={`${idPrefix}-grade-${grade}-summary`}
                        className="block text-sm text-ink-muted"
                      >
                        {GRADE_SUMMARIES[grade]}
                      </span>
                    </span>
                  </label>
                ))}
              </ChoiceGroup>
            )}
          />
          <FormField
            label="Why this grade"
            optional
            hint="The risk assessment behind the grade, for the completion certificate."
            error={errors.gradeRationale?.message}
            className="md:col-span-2"
          >
            {(field) => (
              <textarea
                {...field}
                {...register('gradeRationale')}
                rows={3}
                className={inputClassName()}
              />
            )}
          </FormField>
          <FormField
            label="Environmental class"
            hint="Where most of the equipment is fitted (EN 50131-1). Unheated indoor means halls, stairwells, lofts and garages; class III also covers indoor extremes."
            error={errors.environmentalClass?.message}
          >
            {(field) => (
              <select
                {...field}
                {...register('environmentalClass', { setValueAs: numberOrUndefined })}
                className={selectClassName()}
              >
                <option value="">Choose…</option>
                {ROMAN_CLASSES.map((roman, index) => (
                  <option key={roman} value={index + 1}>
                    Class {roman}: {ENVIRONMENTAL_CLASS_SUMMARIES[index + 1]}
                  </option>
                ))}
              </select>
            )}
          </FormField>
          <FormField
            label="Risk notes"
            optional
            hint="Anything about the premises or its use that shaped the design."
            error={errors.riskNotes?.message}
            className="md:col-span-2"
          >
            {(field) => (
              <textarea
                {...field}
                {...register('riskNotes')}
                rows={3}
                className={inputClassName()}
              />
            )}
          </FormField>
        </FieldGrid>
      </Card>

      <Card title="On arrival" headingLevel={headingLevel}>
        <FieldGrid>
          <FormField
            label="Access notes"
            optional
            hint="How to get in and find the panel: parking, key safe location, gates. Never write codes here."
            error={errors.accessNotes?.message}
          >
            {(field) => (
              <textarea
                {...field}
                {...register('accessNotes')}
                rows={4}
                className={inputClassName()}
              />
            )}
          </FormField>
          <FormField
            label="Hazards"
            optional
            hint="Shown at the top of every page of this site: fragile roofs, known asbestos, loft access, animals."
            error={errors.hazards?.message}
          >
            {(field) => (
              <textarea {...field} {...register('hazards')} rows={4} className={inputClassName()} />
            )}
          </FormField>
        </FieldGrid>
      </Card>

      <Card title="Police response and monitoring" headingLevel={headingLevel}>
        <FieldGrid>
          <FormField
            label="Police URN"
            optional
            hint="The unique reference number the police issued, once police response is granted."
            error={errors.policeUrn?.message}
          >
            {(field) => (
              <input
                {...field}
                {...register('policeUrn', { setValueAs: textOrNull })}
                className={inputClassName({ mono: true })}
                autoComplete="off"
                spellCheck={false}
              />
            )}
          </FormField>
          <FormField
            label="URN status"
            hint={URN_STATUS_HINTS[urnStatus ?? 'none']}
            error={errors.urnStatus?.message}
          >
            {(field) => (
              <select {...field} {...register('urnStatus')} className={selectClassName()}>
                {URN_STATUSES.map((status) => (
                  <option key={status} value={status}>
                    {URN_STATUS_LABELS[status]}
                  </option>
                ))}
              </select>
            )}
          </FormField>
          <Controller
            control={control}
            name="monitoringCentreId"
            render={({ field: { value, onChange, ...field }, fieldState }) => (
              <FormField
                label="Monitoring centre"
                hint={
                  monitoringCentres.isError
                    ? 'The list of monitoring centres could not be loaded. Reload the page to try again.'
                    : 'Leave as "Not monitored" for an audible-only system.'
                }
                error={fieldState.error?.message}
              >
                {(controlProps) => (
                  // Controlled, so the saved choice shows once the list of centres arrives.
                  <select
                    {...controlProps}
                    {...field}
                    value={value ?? ''}
                    onChange={(event) => {
                      const centreId = event.target.value || null;
                      onChange(centreId);
                      // An unmonitored site has no account number to keep.
                      if (!centreId) setValue('monitoringAccount', null);
                    }}
                    className={selectClassName()}
                  >
                    <option value="">
                      {monitoringCentres.isPending
                        ? 'Loading monitoring centres…'
                        : 'Not monitored'}
                    </option>
                    {centreChoices.map((centre) => (
                      <option key={centre.id} value={centre.id}>
                        {centre.name}
                      </option>
                    ))}
                  </select>
                )}
              </FormField>
            )}
          />
          {monitoringCentreId ? (
            <FormField
              label="Monitoring account number"
              hint="As programmed in the panel's communicator: 3 to 16 characters, 0–9 and A–F."
              error={errors.monitoringAccount?.message}
            >
              {(field) => (
                <input
                  {...field}
                  {...register('monitoringAccount', { setValueAs: textOrNull })}
                  className={inputClassName({ mono: true, className: 'max-w-56 uppercase' })}
                  autoComplete="off"
                  spellCheck={false}
                />
              )}
            </FormField>
          ) : (
            <FieldErrorMessage message={errors.monitoringAccount?.message} />
          )}
        </FieldGrid>
      </Card>
    </div>
  );
}
