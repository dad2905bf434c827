import { createProjectSchema, type ProjectView } from '@shared/api/projects.schema.js';
import { Alert } from '@/components/ui/alert.js';
import { Button } from '@/components/ui/button.js';
import { SelectField, TextField } from '@/components/ui/form-field.js';
import { useToast } from '@/components/ui/toast.js';
import { useZodForm } from '@/lib/use-zod-form.js';
import { useUpdateProject } from '../api/update-project.js';
import { PURPOSE_OPTIONS, SCALE_BAND_OPTIONS } from './project-options.js';

/** Edits a project's details (cartographers and admins). */
export function ProjectDetailsForm({ project, onDone }: { project: ProjectView; onDone: () => void }) {
  const update = useUpdateProject(project.id);
  const { notify } = useToast();
  const form = useZodForm(createProjectSchema, {
    title: project.title,
    clientName: project.clientName,
    purpose: project.purpose,
    scaleBand: project.scaleBand,
    notes: project.notes ?? '',
  });
  return (
    <form
      noValidate
      aria-label="Project details"
      className="flex flex-col gap-4"
      onSubmit={form.handleSubmit(async (input) => {
        await update.mutateAsync({ ...input, notes: input.notes || null });
        notify('Project details saved.');
        onDone();
      })}
    >
      {form.formError && <Alert tone="error" title="The changes were not saved">{form.formError}</Alert>}
      <div className="grid gap-4 sm:grid-cols-2">
        <TextField label="Title" {...form.field('title')} />
        <TextField label="Client" {...form.field('clientName')} />
        <SelectField label="Map purpose" options={PURPOSE_OPTIONS} {...form.field('purpose')} />
        <SelectField label="Output scale band" options={SCALE_BAND_OPTIONS} {...form.field('scaleBand')} />
        <TextField label="Notes" fieldClassName="sm:col-span-2" {...form.field('notes')} />
      </div>
      <div className="flex gap-2">
        <Button type="submit" loading={form.submitting}>
          Save
        </Button>
        <Button variant="ghost" onClick={onDone}>
          Cancel
        </Button>
      </div>
    </form>
  );
}
