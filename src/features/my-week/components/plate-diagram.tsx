// One sleeve of the bar, drawn from the middle outwards: the discs for one side, heaviest innermost,
// then the collar. Disc colours follow the federation's kilo colours (our own greys for pounds).
import { loadBar, plateColour, type WeightUnit } from '../../../../shared/calc';

/**
 * Disc diameter and thickness in millimetres, approximate, from memory of calibrated competition discs
 * (kilo) and common iron plates (pound); only the proportions of the drawing depend on them.
 */
const DISC_MM: Readonly<Record<WeightUnit, Readonly<Record<string, { d: number; t: number }>>>> = {
  kg: {
    '25': { d: 450, t: 27 },
    '20': { d: 450, t: 23 },
    '15': { d: 400, t: 21 },
    '10': { d: 325, t: 21 },
    '5': { d: 230, t: 18 },
    '2.5': { d: 190, t: 16 },
    '1.25': { d: 160, t: 12 },
    '0.5': { d: 135, t: 10 },
  },
  lb: {
    '45': { d: 450, t: 38 },
    '35': { d: 400, t: 33 },
    '25': { d: 330, t: 28 },
    '10': { d: 260, t: 22 },
    '5': { d: 230, t: 18 },
    '2.5': { d: 160, t: 14 },
  },
};

const HEIGHT = 72;
const SCALE = HEIGHT / 460;

const SHAFT = 16;
const STOP = 6;

/** Where each disc sits along the sleeve (x, width, height in drawing units), innermost first. */
export function layoutSleeve(perSide: readonly number[], unit: WeightUnit) {
  let x = SHAFT + STOP;
  const placed = [];
  for (const w of perSide) {
    const mm = DISC_MM[unit][String(w)] ?? { d: 200, t: 15 };
    const width = Math.max(7, mm.t * 0.5);
    placed.push({ w, x, width, h: mm.d * SCALE, colour: plateColour(w, unit) });
    x += width + 1;
  }
  const collarX = x + 1;
  return { placed, collarX, total: collarX + 12 + 18 };
}

function perSideText(perSide: number[], unit: WeightUnit): string {
  if (perSide.length === 0) return 'Empty bar';
  return `Each side: ${perSide.join(' + ')} ${unit}`;
}

export function PlateDiagram({ weight, unit }: { weight: number; unit: WeightUnit }) {
  let load: ReturnType<typeof loadBar>;
  try {
    load = loadBar(weight, { unit });
  } catch {
    return <p className="text-sm text-ink-600">Below the empty bar.</p>;
  }
  const { placed, collarX, total } = layoutSleeve(load.perSide, unit);
  const label = perSideText(load.perSide, unit);
  return (
    <figure className="flex flex-col gap-1">
      <svg
        viewBox={`0 0 ${Math.max(total, 120)} ${HEIGHT + 4}`}
        className="h-20 w-full max-w-[16rem]"
        preserveAspectRatio="xMinYMid meet"
        role="img"
        aria-label={`${label}. Total ${load.achieved} ${unit}.`}
      >
        <rect x={0} y={HEIGHT / 2 - 3} width={SHAFT} height={6} rx={1} fill="#8b919b" />
        <rect x={SHAFT} y={HEIGHT / 2 - 10} width={STOP} height={20} rx={1} fill="#5b616b" />
        <rect x={SHAFT + STOP} y={HEIGHT / 2 - 5} width={total - SHAFT - STOP} height={10} rx={2} fill="#a3a9b2" />
        {placed.map((p, i) => (
          <g key={i}>
            <rect
              x={p.x}
              y={(HEIGHT - p.h) / 2 + 2}
              width={p.width}
              height={p.h}
              rx={2}
              fill={p.colour.hex}
              stroke="#111b2e"
              strokeWidth={p.colour.name === 'white' || p.colour.name === 'yellow' ? 1 : 0.5}
            />
          </g>
        ))}
        <rect x={collarX} y={HEIGHT / 2 - 9} width={12} height={18} rx={2} fill="#3c4350" />
      </svg>
      <figcaption className="text-sm text-ink-700">{label}</figcaption>
    </figure>
  );
}
