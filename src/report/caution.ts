/** Shown with every report: what a flag means and does not mean. */
export const CAUTION =
  'A flag is a prompt to look again at a reported result, not proof of an error, and never proof of misconduct. Typesetting, unusual designs and legitimate corrections can all explain a flag.';
