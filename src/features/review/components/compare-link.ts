/** The compare view of the audit for these candidates (2–4 side by side; one shows on its own). */
export const compareHref = (projectId: number, auditId: number, candidateIds: number[]) =>
  `/projects/${projectId}/compare?audit=${auditId}&candidates=${candidateIds.slice(0, 4).join(',')}`;
