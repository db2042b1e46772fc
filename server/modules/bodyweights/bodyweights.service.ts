// What the bodyweights module offers other modules (My week, the e1RM history): the readings and the
// pre-meet gain caution. Its own routes read the repository directly.
export { allBodyweights } from './bodyweights.repository';
export { daysUntil, gainCaution, sevenDayChange } from './caution';
