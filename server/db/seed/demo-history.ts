// Twelve invented weeks of training history for the demo athletes, and the current week planned.
import type { Tx } from '../client';

export interface HistoryContext {
  teamId: number;
  today: Date;
  athleteIds: Map<string, number>;
  variantIds: Map<string, number>;
  coachId: number | null;
}

export async function seedDemoHistory(_tx: Tx, _ctx: HistoryContext): Promise<void> {
  // Filled in once the rotation engine lands, so the history obeys the same rules as the board.
}
