/**
 * What the report says about review, and the caution every report page carries. Review decisions
 * come from elsewhere (a provider passed to the report route); until a diagram is submitted the
 * report says so plainly.
 */

/** The review state of the revision being reported. */
export interface ReviewStatus {
  /** One line, e.g. "Not yet submitted for review" or "Approved". */
  label: string
  /** Who decided and when, comments: shown under the label when present. */
  detail?: string
}

export const NOT_SUBMITTED: ReviewStatus = { label: 'Not yet submitted for review' }

/** The caution shown on every calculation screen and every report page. */
export const DESIGN_AID_CAUTION =
  'Results are a design aid. The plumbing code adopted by the local authority and a licensed ' +
  'professional decide.'
