/** The Audits tab of a project: start audits, follow their progress, read scorecards. */
export function AuditsPanel({ projectId }: { projectId: number }) {
  return (
    <section aria-label="Audits" data-project-id={projectId}>
      <p>Audits for this project will appear here.</p>
    </section>
  );
}
