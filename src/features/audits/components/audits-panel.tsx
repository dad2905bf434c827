import { useQuery } from '@tanstack/react-query';
import { useState } from 'react';
import { Alert } from '@/components/ui/alert.js';
import { Card, CardBody, CardHeader } from '@/components/ui/card.js';
import { Spinner } from '@/components/ui/spinner.js';
import { hasRole, sessionQueryOptions } from '@/features/auth/api/get-session.js';
import { auditsQueryOptions } from '../api/get-audits.js';
import { AuditList } from './audit-list.js';
import { AuditScorecards } from './audit-scorecards.js';
import { StartAuditForm } from './start-audit-form.js';

/** The Audits tab of a project: start audits, follow their progress, read and compare scorecards. */
export function AuditsPanel({ projectId }: { projectId: number }) {
  const session = useQuery(sessionQueryOptions());
  const audits = useQuery(auditsQueryOptions(projectId));
  const [chosen, setChosen] = useState<number | null>(null);
  const canStart = hasRole(session.data, ['admin', 'cartographer']);
  const list = audits.data?.audits ?? [];
  // Until someone picks one, show the newest finished audit.
  const selected = chosen ?? list.find((a) => a.status === 'done')?.id ?? null;
  return (
    <div className="flex flex-col gap-6">
      {canStart && (
        <Card aria-labelledby="start-audit-heading">
          <CardHeader id="start-audit-heading" title="Run an audit" description="Measures every chosen candidate over the current region, in the background." />
          <CardBody>
            <StartAuditForm projectId={projectId} onStarted={() => setChosen(null)} />
          </CardBody>
        </Card>
      )}
      <Card aria-labelledby="audit-list-heading">
        <CardHeader id="audit-list-heading" title="Audits" description="Progress updates by itself while an audit runs." />
        {audits.isPending ? (
          <CardBody>
            <Spinner label="Loading audits" />
          </CardBody>
        ) : audits.isError ? (
          <CardBody>
            <Alert tone="error" title="The audits could not be loaded">{audits.error.message}</Alert>
          </CardBody>
        ) : (
          <AuditList audits={list} selectedId={selected} onSelect={setChosen} />
        )}
      </Card>
      {selected !== null && <AuditScorecards key={selected} projectId={projectId} auditId={selected} />}
    </div>
  );
}
