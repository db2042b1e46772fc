// Per-variant records and the e1RM of a logged set. The maths is shared with the browser (which shows
// the same estimate and record while the set is typed), so it lives once in shared/calc.
export { compareWithRecord, heavierThan, recordOf, topSetE1rmKg } from '../../../shared/calc';
