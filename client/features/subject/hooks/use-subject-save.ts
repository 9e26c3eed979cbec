import { useState } from 'react';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { UseFormReturn } from 'react-hook-form';
import type { Subject } from '@contracts/assignments';
import { describeError, isApiError } from '../../../lib/api-error';
import { invalidateAssignmentSales } from '../../../lib/assignment-cache';
import { compareEditsWithServer, fieldsChangedElsewhere, type EditConflictRow } from '../../../lib/edit-conflict';
import { applyServerFieldErrors } from '../../../lib/form-errors';
import { assignmentQueries } from '../../assignments/api/assignment-queries';
import { subjectRequests } from '../api/subject-queries';
import { subjectBody, subjectFields, subjectToForm, type SubjectField, type SubjectFormOutput, type SubjectFormValues } from '../lib/subject-form';

export interface SubjectConflict {
  rows: EditConflictRow<SubjectField>[];
  otherFields: SubjectField[];
  fresh: Subject;
  edited: SubjectField[];
}

type SubjectForm = UseFormReturn<SubjectFormValues, unknown, SubjectFormOutput>;

/** Saves the subject with the version the form started from. A 409 loads the saved subject and
 * lays out the differences; the person then carries their edits over or drops them. */
export function useSubjectSave(assignmentId: number, form: SubjectForm, initial: Subject) {
  const queryClient = useQueryClient();
  const [base, setBase] = useState(() => ({ values: subjectToForm(initial), version: initial.version }));
  const [conflict, setConflict] = useState<SubjectConflict | null>(null);
  const [failure, setFailure] = useState<string | null>(null);

  const startFrom = (subject: Subject, keepEdits: SubjectField[] = []) => {
    const yours = form.getValues();
    const now = subjectToForm(subject);
    setBase({ values: now, version: subject.version });
    form.reset(now);
    for (const field of keepEdits) form.setValue(field, yours[field], { shouldDirty: true });
  };

  const save = useMutation({
    mutationFn: (values: SubjectFormOutput) => subjectRequests.save(assignmentId, subjectBody(values, base.version)),
    onSuccess: (subject) => {
      queryClient.setQueryData(assignmentQueries.detail(assignmentId).queryKey, (detail) => (detail ? { ...detail, subject } : detail));
      startFrom(subject);
    },
    onError: async (error) => {
      if (isApiError(error) && error.code === 'stale_version') {
        const edited = Object.keys(form.formState.dirtyFields) as SubjectField[];
        const detail = await queryClient.fetchQuery({ ...assignmentQueries.detail(assignmentId), staleTime: 0 });
        const now = subjectToForm(detail.subject);
        setConflict({
          rows: compareEditsWithServer(edited, base.values, form.getValues(), now),
          otherFields: fieldsChangedElsewhere(subjectFields, edited, base.values, now),
          fresh: detail.subject,
          edited,
        });
        return;
      }
      if (!applyServerFieldErrors(error, form.setError, subjectFields)) setFailure(describeError(error));
    },
    // The subject's area and neighbourhood feed the analysis; its revision is on the assignment.
    onSettled: () => invalidateAssignmentSales(queryClient, assignmentId),
  });

  const submit = form.handleSubmit((values) => {
    setFailure(null);
    save.mutate(values);
  });

  const resolve = (keepMine: boolean) => {
    if (!conflict) return;
    startFrom(conflict.fresh, keepMine ? conflict.edited : []);
    setConflict(null);
  };

  return { submit, save, conflict, failure, resolve };
}
