import type { AuditSummary } from '@shared/api/audits.schema.js';
import { Button } from '@/components/ui/button.js';
import { AuditProgress } from './audit-progress.js';

const when = (iso: string) => new Date(iso).toLocaleString(undefined, { dateStyle: 'medium', timeStyle: 'short' });

/** The project's audits, newest first, with live status; failures show their message. */
export function AuditList({ audits, selectedId, onSelect }: { audits: AuditSummary[]; selectedId: number | null; onSelect: (id: number) => void }) {
  if (!audits.length) return <p className="px-5 py-4 text-sm text-ink-600">No audits yet.</p>;
  return (
    <ul className="divide-y divide-rule" aria-label="Audits">
      {audits.map((a) => (
        <li key={a.id} className="flex flex-wrap items-center justify-between gap-3 px-5 py-3" data-audit-id={a.id}>
          <div className="min-w-0">
            <p className="text-sm font-medium text-ink-950">
              Audit {a.id} · {a.candidateIds.length} candidate{a.candidateIds.length === 1 ? '' : 's'} · {a.settings.samples.toLocaleString()} samples
            </p>
            <p className="text-xs text-ink-600">
              Started {when(a.createdAt)} · seed {a.settings.seed} · engine {a.engineVersion}
            </p>
            {a.status === 'failed' && a.error && (
              <p role="alert" className="mt-1 text-sm text-vermilion-700">
                {a.error}
              </p>
            )}
          </div>
          <div className="flex items-center gap-3">
            <AuditProgress audit={a} />
            {a.status === 'done' && (
              <Button size="sm" variant={selectedId === a.id ? 'primary' : 'secondary'} onClick={() => onSelect(a.id)} aria-pressed={selectedId === a.id}>
                Scorecards
              </Button>
            )}
          </div>
        </li>
      ))}
    </ul>
  );
}
