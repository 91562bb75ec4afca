// The safety cautions every report carries: the same points as components/SafetyCaution.tsx
// shows on screen, as plain text for files. The report reminds; it does not replace the site's
// permit-to-work and local codes.
export const REPORT_CAUTIONS_TITLE = 'Before work on a steam trap';

export const REPORT_CAUTIONS: readonly string[] = [
  'Surfaces, condensate and flash steam are hot enough to burn: wear gloves, eye protection and long sleeves.',
  'Measure from the outside only. Never open, unbolt or tap a trap that is under pressure.',
  'Before any repair: isolate upstream and downstream, depressurise and drain, apply lockout/tagout, and let it cool.',
  'Watch for live steam from vents, test valves and discharges to atmosphere; keep clear of the outlet.',
  "Follow your site's permit-to-work, local codes and licensed practice; they take precedence over this reminder.",
];
