/** Buttons in four weights (also used on links that act as buttons). All are at least 44 px tall, for gloved or hurried hands. */
import type { ButtonHTMLAttributes } from 'react'

type Variant = 'primary' | 'secondary' | 'quiet' | 'danger'

const VARIANTS: Record<Variant, string> = {
  primary: 'bg-signal text-surface hover:bg-signal-strong hover:text-surface border border-signal no-underline',
  secondary: 'bg-surface text-ink border border-field hover:bg-signal-soft hover:text-ink no-underline',
  quiet: 'bg-transparent text-signal underline underline-offset-4 hover:text-signal-strong border border-transparent',
  danger: 'bg-surface text-danger border border-danger hover:bg-danger-soft hover:text-danger no-underline',
}

export const buttonClass = (variant: Variant = 'primary', extra = '') =>
  `inline-flex min-h-11 items-center justify-center gap-2 rounded-control px-4 py-2 font-semibold disabled:cursor-not-allowed disabled:opacity-60 ${VARIANTS[variant]} ${extra}`

export function Button({ variant = 'primary', className = '', type = 'button', ...rest }: ButtonHTMLAttributes<HTMLButtonElement> & { variant?: Variant }) {
  return <button type={type} className={buttonClass(variant, className)} {...rest} />
}
