import type { StepProps } from './step-registry';
import { Notice } from '../../../components/ui/notice';
import { useSessionUser } from '../../../features/auth/hooks/use-session-user';
import { CompMap } from '../../../features/comp-map/lazy-comp-map';
import { PhotoDropZone } from '../../../features/photos/components/photo-drop-zone';
import { PhotoStrip } from '../../../features/photos/components/photo-strip';
import { SubjectForm } from '../../../features/subject/components/subject-form';

const NO_SALES: [] = [];
const EDITABLE_STATUSES = new Set(['in_progress', 'revisions_requested']);

/** Step 1: the subject's location, characteristics and photos. */
export function SubjectStep({ detail }: StepProps) {
  const user = useSessionUser();
  const { assignment, subject } = detail;
  const editable = user.role === 'appraiser' && EDITABLE_STATUSES.has(assignment.status);
  return (
    <div className="flex flex-col gap-6">
      {!editable && (
        <Notice>{user.role === 'appraiser' ? 'This assignment is with the reviewer or signed: the subject is shown as it stands.' : 'You are reading the subject; only the appraiser changes it.'}</Notice>
      )}
      {/* Keyed by assignment: the form starts from the subject it was opened with and keeps the person's typing after that. */}
      <SubjectForm
        key={assignment.id}
        assignmentId={assignment.id}
        subject={subject}
        areaUnit={assignment.areaUnit}
        editable={editable}
        renderMap={(location, onPick) => (
          <CompMap
            label="Map for placing the subject"
            className="h-[20rem] min-[1025px]:h-[24rem]"
            areaUnit={assignment.areaUnit}
            subject={location}
            sales={NO_SALES}
            onPickLocation={onPick}
          />
        )}
      />
      <section aria-labelledby="subject-photos-title" className="flex flex-col gap-3 rounded-lg border border-rule bg-paper-raised/60 p-5">
        <header>
          <h3 id="subject-photos-title" className="font-semibold text-ink">
            Photos of the subject
          </h3>
          <p className="text-[0.875rem] text-ink-soft">Location data is stripped from every photo when it is stored.</p>
        </header>
        <PhotoStrip assignmentId={assignment.id} saleId={null} editable={editable} />
        {editable && <PhotoDropZone assignmentId={assignment.id} saleId={null} />}
      </section>
    </div>
  );
}
