/** The three cautions, word for word as the product states them. They appear on the analysis page,
 * the report page and the PDF, and are frozen into every signed report. */
export const CAUTIONS = [
  'The output supports an appraiser\'s judgement; a value opinion is valid only when developed and signed by an appraiser licensed or certified where the property lies, under the appraisal standards and client guidelines that govern there. Defer to them.',
  'A fitted line describes the sales given, not the market; small samples, extrapolation beyond the sales\' range and features the model leaves out all weaken it.',
  'A flagged sale is a question, not a verdict: exclude only with a reason from the facts of the sale.',
] as const;

/** Compline's own certification wording, confirmed by the appraiser at signing. */
export const CERTIFICATION_STATEMENTS = [
  'I inspected the subject property, or state otherwise in the assumptions below, and the facts in this report are true and correct to the best of my knowledge.',
  'The analyses, opinions and conclusions are my own, impartial and unbiased, and limited only by the assumptions and conditions stated here.',
  'I have no present or prospective interest in the property and no personal interest in the parties, and my fee does not depend on the value reported.',
  'I developed the opinion of value under the appraisal standards and the client guidelines that govern where the property lies, and I am licensed or certified to appraise it there.',
  'Every sale set aside from the analysis is listed with the reason, drawn from the facts of that sale.',
] as const;

export const LIMITING_CONDITIONS = [
  'The opinion of value holds as of the effective date only; markets change.',
  'Legal title, survey matters and environmental conditions were not examined; the property is appraised as free of defects not apparent on inspection.',
  'Sale data come from the sources named for each sale and were verified as stated; their accuracy is assumed where not verified.',
  'The statistical figures describe the sales used; they support, and do not replace, the appraiser’s judgement.',
  'This report is for the named client and intended use; no other party may rely on it.',
] as const;
