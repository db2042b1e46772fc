// Form controls on the athlete's phone pages are at least 44 px tall, a thumb's width.
export const TOUCH = { minHeight: '2.75rem' } as const;
