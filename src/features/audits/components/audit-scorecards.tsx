import { useQuery } from '@tanstack/react-query';
import { useState } from 'react';
import { Link } from 'react-router';
import { Alert } from '@/components/ui/alert.js';
import { buttonClasses } from '@/components/ui/button.js';
import { Card, CardHeader } from '@/components/ui/card.js';
import { Spinner } from '@/components/ui/spinner.js';
import { auditQueryOptions } from '../api/get-audit.js';
import { compareUrl, definitionUrl, samplesGeoJsonUrl, scorecardsCsvUrl, scorecardsJsonUrl } from '../api/download-urls.js';
import { ScorecardTable } from './scorecard-table.js';

/** One finished audit: its scorecard table, downloads, and the choice of candidates to compare. */
export function AuditScorecards({ projectId, auditId }: { projectId: number; auditId: number }) {
  const audit = useQuery(auditQueryOptions(auditId));
  const [picked, setPicked] = useState<number[]>([]);
  if (audit.isPending) return <Spinner label="Loading scorecards" />;
  if (audit.isError) return <Alert tone="error" title="The scorecards could not be loaded">{audit.error.message}</Alert>;
  const a = audit.data;
  const toggle = (id: number) => setPicked((p) => (p.includes(id) ? p.filter((x) => x !== id) : p.length < 4 ? [...p, id] : p));
  return (
    <Card aria-labelledby={`scorecards-${a.id}`}>
      <CardHeader
        id={`scorecards-${a.id}`}
        title={`Scorecards of audit ${a.id}`}
        description={`${a.settings.samples.toLocaleString()} equal-area samples, seed ${a.settings.seed}, engine ${a.engineVersion}`}
        actions={
          <>
            <a className={buttonClasses('secondary', 'sm')} href={scorecardsCsvUrl(a.id)} download>
              CSV
            </a>
            <a className={buttonClasses('secondary', 'sm')} href={scorecardsJsonUrl(a.id)} download>
              JSON
            </a>
          </>
        }
      />
      <ScorecardTable cards={a.scorecards} purpose={a.purpose} />
      <div className="flex flex-col gap-3 border-t border-rule px-5 py-4">
        <fieldset className="flex flex-wrap gap-x-5 gap-y-2">
          <legend className="mb-2 text-sm font-medium text-ink-950">Compare side by side (choose 2 to 4)</legend>
          {a.scorecards.map((c) => (
            <label key={c.candidateId} className="flex items-center gap-2 text-sm">
              <input type="checkbox" checked={picked.includes(c.candidateId)} onChange={() => toggle(c.candidateId)} disabled={!picked.includes(c.candidateId) && picked.length >= 4} />
              {c.label}
            </label>
          ))}
        </fieldset>
        <div>
          {picked.length >= 2 ? (
            <Link className={buttonClasses('primary', 'sm')} to={compareUrl(projectId, a.id, picked)}>
              Compare {picked.length} candidates
            </Link>
          ) : (
            <span className={buttonClasses('primary', 'sm', 'pointer-events-none opacity-55')} aria-disabled="true">
              Compare
            </span>
          )}
        </div>
        <details className="text-sm">
          <summary className="cursor-pointer text-mulberry-700">Downloads per candidate</summary>
          <ul className="mt-2 flex flex-col gap-1">
            {a.scorecards.map((c) => (
              <li key={c.candidateId} className="flex flex-wrap gap-3">
                <span className="font-medium">{c.label}:</span>
                <a className="text-mulberry-700 underline" href={definitionUrl(projectId, c.candidateId, 'proj')} download>PROJ string</a>
                <a className="text-mulberry-700 underline" href={definitionUrl(projectId, c.candidateId, 'wkt')} download>WKT</a>
                <a className="text-mulberry-700 underline" href={samplesGeoJsonUrl(a.id, c.candidateId)} download>samples (GeoJSON)</a>
              </li>
            ))}
          </ul>
        </details>
      </div>
    </Card>
  );
}
