/**
 * What a sign-off does and does not vouch for, printed on every sheet. Plain words of our own;
 * the acceptance test of the sheet looks for each of these sentences in the PDF's text.
 */
export const SHEET_CAUTIONS: readonly string[] = [
  'Not for navigation: this sheet records a choice of map projection, not a chart fit for finding a way.',
  'Boundaries are illustrative only and imply no position on the legal status of any territory or the course of any border.',
  'Areas and distances are measured on the ellipsoid, not from the map; never scale them off a projected drawing.',
  'The figures describe how the projection distorts the sampled region, not how accurate the source boundaries are.',
  "For legal, cadastral or engineering use, defer to the client's own standards and to a licensed surveyor.",
];
