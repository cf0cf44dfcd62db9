/** A form's submit button: while the form is on its way it is disabled and says what is happening. */
import type { ReactNode } from 'react'
import { Button } from './button'

export function SubmitButton({
  submitting,
  pendingLabel,
  children,
  variant,
  className,
}: {
  submitting: boolean
  pendingLabel: string
  children: ReactNode
  variant?: 'primary' | 'secondary' | 'danger'
  className?: string
}) {
  return (
    <Button type="submit" variant={variant} disabled={submitting} className={className}>
      {submitting ? pendingLabel : children}
    </Button>
  )
}
