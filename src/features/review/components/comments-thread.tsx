import { useQuery } from '@tanstack/react-query';
import { useState, type FormEvent } from 'react';
import { createCommentSchema } from '@shared/api/review.schema.js';
import { Alert } from '@/components/ui/alert.js';
import { Badge } from '@/components/ui/badge.js';
import { Button } from '@/components/ui/button.js';
import { Card, CardBody, CardHeader } from '@/components/ui/card.js';
import { FormField } from '@/components/ui/form-field.js';
import { Spinner } from '@/components/ui/spinner.js';
import { isApiError } from '@/lib/api-client.js';
import { ROLE_LABELS } from '@/lib/role-labels.js';
import { useAddComment } from '../api/add-comment.js';
import { commentsQueryOptions } from '../api/get-comments.js';
import { formatDateTime } from './format-time.js';
import { TextArea } from './text-area.js';

/** The project's conversation, seen alike by the studio and the project's reviewers. */
export function CommentsThread({ projectId }: { projectId: number }) {
  const comments = useQuery(commentsQueryOptions(projectId));
  const add = useAddComment(projectId);
  const [body, setBody] = useState('');
  const [error, setError] = useState<string | undefined>();

  const submit = async (e: FormEvent) => {
    e.preventDefault();
    const parsed = createCommentSchema.safeParse({ body });
    if (!parsed.success) return setError(parsed.error.issues[0]?.message);
    setError(undefined);
    try {
      await add.mutateAsync(parsed.data);
      setBody('');
    } catch (err) {
      setError(isApiError(err) ? err.message : 'The comment was not posted. Please try again.');
    }
  };

  return (
    <Card aria-labelledby="comments-heading">
      <CardHeader id="comments-heading" title="Comments" description="Visible to the studio and to this project’s reviewers." />
      <CardBody className="flex flex-col gap-4">
        {comments.isPending && <Spinner label="Loading comments…" />}
        {comments.isError && <Alert tone="error">The comments could not be loaded.</Alert>}
        {comments.data && comments.data.comments.length === 0 && <p className="text-sm text-ink-600">No comments yet.</p>}
        {comments.data && comments.data.comments.length > 0 && (
          <ol className="flex flex-col gap-3" aria-label="Comments, oldest first">
            {comments.data.comments.map((c) => (
              <li key={c.id} className="rounded-md border border-rule px-4 py-3">
                <p className="flex flex-wrap items-center gap-2 text-xs text-ink-600">
                  <span className="font-semibold text-ink-950">{c.authorName}</span>
                  <Badge tone={c.authorRole === 'client' ? 'brand' : 'neutral'}>{ROLE_LABELS[c.authorRole]}</Badge>
                  <time dateTime={c.createdAt}>{formatDateTime(c.createdAt)}</time>
                </p>
                <p className="mt-1 text-sm whitespace-pre-line text-ink-950">{c.body}</p>
              </li>
            ))}
          </ol>
        )}
        <form noValidate aria-label="Add a comment" onSubmit={submit} className="flex flex-col gap-3">
          <FormField label="Your comment" error={error}>
            {(control) => <TextArea {...control} name="comment" rows={3} value={body} onChange={(e) => setBody(e.target.value)} />}
          </FormField>
          <div>
            <Button type="submit" size="sm" loading={add.isPending}>
              Post comment
            </Button>
          </div>
        </form>
      </CardBody>
    </Card>
  );
}
