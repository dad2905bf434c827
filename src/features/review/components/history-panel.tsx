import { useQuery } from '@tanstack/react-query';
import { Alert } from '@/components/ui/alert.js';
import { Card, CardBody, CardHeader } from '@/components/ui/card.js';
import { Spinner } from '@/components/ui/spinner.js';
import { ROLE_LABELS } from '@/lib/role-labels.js';
import type { Role } from '@shared/api/roles.js';
import { activityQueryOptions } from '../api/get-activity.js';
import { formatDateTime } from './format-time.js';

const roleWord = (r: string) => (r in ROLE_LABELS ? ROLE_LABELS[r as Role] : 'Warpmeter');

/** The project's history (studio staff): uploads, candidates, audits, shortlists and decisions, newest first. */
export function HistoryPanel({ projectId }: { projectId: number }) {
  const activity = useQuery(activityQueryOptions(projectId));
  return (
    <Card aria-labelledby="history-heading">
      <CardHeader id="history-heading" title="History" description="Who changed what, and when." />
      <CardBody>
        {activity.isPending && <Spinner label="Loading the history…" />}
        {activity.isError && <Alert tone="error">The history could not be loaded.</Alert>}
        {activity.data && activity.data.events.length === 0 && <p className="text-sm text-ink-600">Nothing has happened here yet.</p>}
        {activity.data && activity.data.events.length > 0 && (
          <ol className="relative ml-2 border-l border-rule" aria-label="Project history, newest first">
            {activity.data.events.map((e) => (
              <li key={e.id} className="relative pb-4 pl-5 last:pb-0">
                <span className="absolute top-1.5 -left-[5px] size-2.5 rounded-full bg-mulberry-600" aria-hidden="true" />
                <p className="text-sm text-ink-950">{e.summary}</p>
                <p className="text-xs text-ink-600">
                  {e.actorName} · {roleWord(e.actorRole)} · <time dateTime={e.createdAt}>{formatDateTime(e.createdAt)}</time>
                </p>
              </li>
            ))}
          </ol>
        )}
      </CardBody>
    </Card>
  );
}
