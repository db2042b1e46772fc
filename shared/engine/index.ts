// Public entry of the rotation engine: pure TypeScript shared by the browser and the server.
// The connective-tissue module is imported from ./tissue directly, so pages that only plan rotations
// do not carry it.

export * from './types';
export * from './weeks';
export { generatePlan } from './plan';
export { checkPlan } from './check';
export {
  candidateScore,
  explainCandidate,
  prepareCandidateChecks,
  NEAR_BUDGET,
  type CandidateChecks,
  type CandidateRating,
} from './explain';
export { jointLoadSeries, peakLoadRatio, type JointLoadPoint } from './load';
export { jointName, jointLoad as jointLoadLabel, emphasisName } from './words';
export * from './alternatives';
