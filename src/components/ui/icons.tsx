// Rackturn's own small line icons; state icons always come with words beside them.
import type { SVGProps } from 'react';

/** Shared frame of our line icons: 20-unit grid, stroked in the current text colour, hidden from readers. */
export const iconFrame = {
  width: 18,
  height: 18,
  viewBox: '0 0 20 20',
  fill: 'none',
  stroke: 'currentColor',
  strokeWidth: 2,
  'aria-hidden': true,
} as const;

export const CleanIcon = (p: SVGProps<SVGSVGElement>) => (
  <svg {...iconFrame} {...p}>
    <circle cx="10" cy="10" r="8" />
    <path d="M6 10.5l2.5 2.5L14 7.5" strokeLinecap="round" strokeLinejoin="round" />
  </svg>
);
export const WarningIcon = (p: SVGProps<SVGSVGElement>) => (
  <svg {...iconFrame} {...p}>
    <path d="M10 2.5l8 14.5H2z" strokeLinejoin="round" />
    <path d="M10 8v4M10 14.5v.5" strokeLinecap="round" />
  </svg>
);
export const BreakIcon = (p: SVGProps<SVGSVGElement>) => (
  <svg {...iconFrame} {...p}>
    <path d="M6.5 2h7L18 6.5v7L13.5 18h-7L2 13.5v-7z" strokeLinejoin="round" />
    <path d="M7 7l6 6M13 7l-6 6" strokeLinecap="round" />
  </svg>
);
export const PinIcon = (p: SVGProps<SVGSVGElement>) => (
  <svg {...iconFrame} {...p}>
    <path d="M7 2h6l-1 5 3 3H5l3-3zM10 10v8" strokeLinejoin="round" strokeLinecap="round" />
  </svg>
);
