// How the library's values read on screen.
import { JOINTS, type Joint, type Lift } from '../../../../shared/engine/types';
import { jointName } from '../../../../shared/engine/words';

export const LIFT_LABEL: Record<Lift, string> = { squat: 'Squat', bench: 'Bench', deadlift: 'Deadlift' };
export const EMPHASIS_LABEL = { bottom: 'Bottom', midRange: 'Mid-range', lockout: 'Lockout' } as const;
export const SCHEME_LABEL = { single: 'Single', triple: 'Triple', five: 'Five' } as const;
export const RISK_LABEL: Record<1 | 2 | 3, string> = { 1: '1 · low', 2: '2 · moderate', 3: '3 · high' };
export const STRESS_LABEL = ['0 · none', '1 · light', '2 · moderate', '3 · heavy'] as const;

export const jointLabel = (j: Joint) => jointName(j).replace(/^./, (c) => c.toUpperCase());

/** Joints under load, heaviest first: "Elbow 3, wrist 1". */
export function stressSummary(stress: Partial<Record<Joint, number>>): string {
  const parts = JOINTS.filter((j) => (stress[j] ?? 0) > 0)
    .sort((a, b) => (stress[b] ?? 0) - (stress[a] ?? 0))
    .map((j) => `${jointName(j)} ${stress[j]}`);
  if (parts.length === 0) return 'No notable joint stress';
  const text = parts.join(', ');
  return text.charAt(0).toUpperCase() + text.slice(1);
}
