import { useNavigate } from 'react-router';
import { createProjectSchema } from '@shared/api/projects.schema.js';
import { Alert } from '@/components/ui/alert.js';
import { Button } from '@/components/ui/button.js';
import { SelectField, TextField } from '@/components/ui/form-field.js';
import { useToast } from '@/components/ui/toast.js';
import { useZodForm } from '@/lib/use-zod-form.js';
import { useCreateProject } from '../api/create-project.js';
import { PURPOSE_OPTIONS, SCALE_BAND_OPTIONS } from './project-options.js';

/** Creates a project and opens it, ready for its region. */
export function CreateProjectForm({ onDone }: { onDone?: () => void }) {
  const create = useCreateProject();
  const navigate = useNavigate();
  const { notify } = useToast();
  const form = useZodForm(createProjectSchema, { title: '', clientName: '', purpose: 'equal-area', scaleBand: 'country', notes: '' });
  return (
    <form
      noValidate
      aria-label="New map project"
      className="flex flex-col gap-4"
      onSubmit={form.handleSubmit(async (input) => {
        const project = await create.mutateAsync(input);
        notify(`“${project.title}” created. Upload its region next.`);
        onDone?.();
        await navigate(`/projects/${project.id}`);
      })}
    >
      {form.formError && <Alert tone="error" title="The project was not created">{form.formError}</Alert>}
      <div className="grid gap-4 sm:grid-cols-2">
        <TextField label="Title" placeholder="Great Lakes watershed atlas" {...form.field('title')} />
        <TextField label="Client" placeholder="Who the map is for" {...form.field('clientName')} />
        <SelectField label="Map purpose" options={PURPOSE_OPTIONS} hint="Decides which ranking of candidates fits." {...form.field('purpose')} />
        <SelectField label="Output scale band" options={SCALE_BAND_OPTIONS} {...form.field('scaleBand')} />
        <TextField label="Notes" fieldClassName="sm:col-span-2" placeholder="Optional" {...form.field('notes')} />
      </div>
      <div className="flex gap-2">
        <Button type="submit" loading={form.submitting}>
          Create project
        </Button>
        {onDone && (
          <Button variant="ghost" onClick={onDone}>
            Cancel
          </Button>
        )}
      </div>
    </form>
  );
}
