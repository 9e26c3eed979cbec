import { useEffect, useMemo, useRef, type ReactNode } from 'react';
import { useForm, useWatch } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import type { Subject } from '@contracts/assignments';
import { Button } from '../../../components/ui/button';
import { Notice } from '../../../components/ui/notice';
import { useSubjectSave } from '../hooks/use-subject-save';
import { subjectFieldLabels, subjectFormSchema, subjectToForm, type SubjectFormOutput, type SubjectFormValues } from '../lib/subject-form';
import { StaleEditNotice } from '../../../components/forms/stale-edit-notice';
import { SubjectHouseFields } from './subject-house-fields';
import { parseLocation, SubjectLocationFields, useLocationFill } from './subject-location';

export interface LonLat {
  lon: number;
  lat: number;
}

interface SubjectFormProps {
  assignmentId: number;
  subject: Subject;
  areaUnit: 'sqft' | 'sqm';
  editable: boolean;
  /** The map to place the subject on; the page supplies it (features do not import each other). */
  renderMap: (location: LonLat | null, onPick: ((at: LonLat) => void) | undefined) => ReactNode;
}

function Panel({ title, description, children }: { title: string; description: string; children: ReactNode }) {
  return (
    <section className="flex flex-col gap-4 rounded-lg border border-rule bg-paper-raised/60 p-5">
      <header>
        <h3 className="font-semibold text-ink">{title}</h3>
        <p className="text-[0.875rem] text-ink-soft">{description}</p>
      </header>
      {children}
    </section>
  );
}

/** The subject's location and characteristics, saved together with the version they started from. */
export function SubjectForm({ assignmentId, subject, areaUnit, editable, renderMap }: SubjectFormProps) {
  const areaSymbol = areaUnit === 'sqft' ? 'ft²' : 'm²';
  const labels = useMemo(() => subjectFieldLabels(areaSymbol), [areaSymbol]);
  const form = useForm<SubjectFormValues, unknown, SubjectFormOutput>({ resolver: zodResolver(subjectFormSchema), defaultValues: subjectToForm(subject) });
  const { submit, save, conflict, failure, resolve } = useSubjectSave(assignmentId, form, subject);
  const [lonText, latText] = useWatch({ control: form.control, name: ['lon', 'lat'] });
  const location = parseLocation(lonText, latText);
  const fill = useLocationFill(form);
  const { isDirty } = form.formState;
  // The comparison after a lost race is shown at the top of the form: bring it into view.
  const conflictRef = useRef<HTMLDivElement>(null);
  useEffect(() => {
    if (!conflict) return;
    conflictRef.current?.scrollIntoView({ behavior: 'smooth', block: 'start' });
    conflictRef.current?.focus({ preventScroll: true });
  }, [conflict]);

  return (
    <form onSubmit={submit} noValidate aria-label="Subject" className="flex flex-col gap-5">
      {conflict && (
        <div ref={conflictRef} tabIndex={-1} className="scroll-mt-4 outline-none">
          <StaleEditNotice title="Someone else saved the subject while you were editing" rows={conflict.rows} otherFields={conflict.otherFields} labels={labels} onKeepMine={() => resolve(true)} onTakeTheirs={() => resolve(false)} />
        </div>
      )}
      {failure && <Notice tone="error">{failure}</Notice>}
      <fieldset disabled={!editable} className="grid items-start gap-5 min-[1025px]:grid-cols-[minmax(0,6fr)_minmax(0,5fr)]">
        <Panel title="The house" description={`Areas in ${areaSymbol}; condition and quality on Compline’s six-step scales, 1 best.`}>
          <SubjectHouseFields form={form} labels={labels} />
        </Panel>
        <Panel title="Location" description={editable ? 'Click the map to place the subject, or type its coordinates.' : 'Where the subject stands.'}>
          {renderMap(location, editable ? fill.place : undefined)}
          <SubjectLocationFields form={form} labels={labels} fill={fill} />
        </Panel>
      </fieldset>
      {editable && (
        <div className="flex flex-wrap items-center gap-4 border-t border-rule pt-4">
          <Button type="submit" variant="primary" busy={save.isPending} busyLabel="Saving…" disabled={conflict !== null}>
            Save the subject
          </Button>
          <p className="text-sm text-ink-soft" aria-live="polite">
            {conflict
              ? 'Not saved: someone else saved first. Compare above, then save again.'
              : save.isPending
                ? ''
                : isDirty
                  ? 'You have unsaved changes.'
                  : save.isSuccess
                    ? 'Saved. The analysis uses the new figures.'
                    : 'No unsaved changes.'}
          </p>
          {isDirty && !save.isPending && !conflict && (
            <Button variant="quiet" onClick={() => form.reset()}>
              Undo my changes
            </Button>
          )}
        </div>
      )}
    </form>
  );
}
