// The safety points shown wherever Plumeward guides field work or repairs: on screen
// (components/SafetyCaution.tsx), in reports and in e-mails. One list, so all three say the same.
// Steam work can hurt people; these remind, they do not replace the site's permit-to-work.
export const SAFETY_TITLE = 'Before work on a steam trap';

export const SAFETY_POINTS = [
  'Isolate the trap upstream and downstream before any work, and apply lockout/tagout.',
  'Depressurise and drain the line, and let it cool: surfaces, condensate and flash steam burn.',
  'Wear protective equipment: gloves, eye protection and long sleeves; keep clear of the outlet.',
  'Never open, unbolt or tap a trap that is under pressure.',
  "Follow your site's permit-to-work, local codes and licensed practice; they take precedence over this reminder.",
] as const;
