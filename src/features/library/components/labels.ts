// How the library's own values read on screen (lift, risk and stress words are in shared/labels).
import { JOINTS, type Joint } from '../../../../shared/engine/types';
import { jointName } from '../../../../shared/engine/words';

export const EMPHASIS_LABEL = { bottom: 'Bottom', midRange: 'Mid-range', lockout: 'Lockout' } as const;
export const SCHEME_LABEL = { single: 'Single', triple: 'Triple', five: 'Five' } as const;

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
