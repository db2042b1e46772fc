// Buttons: one rust primary action per view, quieter ink ones for the rest; at least 44 px tall on touch.
import type { ButtonHTMLAttributes } from 'react';

type Variant = 'primary' | 'secondary' | 'ghost' | 'danger';
type Size = 'sm' | 'md' | 'lg';

const variants: Record<Variant, string> = {
  primary: 'bg-rust-500 text-chalk-50 hover:bg-rust-600 active:bg-rust-700 disabled:bg-rust-300',
  secondary:
    'border border-ink-600 text-ink-900 bg-chalk-50 hover:bg-chalk-200 disabled:text-ink-400 disabled:border-ink-300',
  ghost: 'text-ink-800 hover:bg-chalk-200 disabled:text-ink-400',
  danger: 'bg-breach-600 text-chalk-50 hover:bg-breach-700 disabled:opacity-60',
};
const sizes: Record<Size, string> = {
  sm: 'min-h-9 px-3 text-sm',
  md: 'min-h-11 px-4 text-base',
  lg: 'min-h-12 px-5 text-lg',
};

export function buttonClass(variant: Variant = 'primary', size: Size = 'md', extra = ''): string {
  return `inline-flex items-center justify-center gap-2 rounded-md font-semibold transition-colors disabled:cursor-not-allowed ${variants[variant]} ${sizes[size]} ${extra}`;
}

export function Button({
  variant = 'primary',
  size = 'md',
  className = '',
  type = 'button',
  ...props
}: ButtonHTMLAttributes<HTMLButtonElement> & { variant?: Variant; size?: Size }) {
  return <button type={type} className={buttonClass(variant, size, className)} {...props} />;
}
