/**
 * Small drawn signs that mark a message's tone besides its colour. Drawn (not typed) so they
 * add nothing to the text that screen readers and tests read.
 */
export type SignKind = 'info' | 'ok' | 'caution' | 'danger'

export function Sign({ kind, sizePx = 18 }: { kind: SignKind; sizePx?: number }) {
  return (
    <svg aria-hidden="true" width={sizePx} height={sizePx} viewBox="0 0 20 20" className="mt-0.5 shrink-0">
      {kind === 'info' && (
        <>
          <circle cx="10" cy="10" r="8.5" fill="none" stroke="currentColor" strokeWidth="2" />
          <path d="M10 9v5.5M10 5.5v.5" stroke="currentColor" strokeWidth="2.2" strokeLinecap="round" />
        </>
      )}
      {kind === 'ok' && (
        <>
          <circle cx="10" cy="10" r="8.5" fill="none" stroke="currentColor" strokeWidth="2" />
          <path d="m6 10.5 3 3 5-6" fill="none" stroke="currentColor" strokeWidth="2.2" strokeLinecap="round" strokeLinejoin="round" />
        </>
      )}
      {kind === 'caution' && (
        <>
          <path d="M10 1.8 18.6 17H1.4Z" fill="none" stroke="currentColor" strokeWidth="2" strokeLinejoin="round" />
          <path d="M10 7.5v4.5M10 14.5v.3" stroke="currentColor" strokeWidth="2.2" strokeLinecap="round" />
        </>
      )}
      {kind === 'danger' && (
        <>
          <path d="M6.2 1.5h7.6l4.7 4.7v7.6l-4.7 4.7H6.2l-4.7-4.7V6.2Z" fill="none" stroke="currentColor" strokeWidth="2" strokeLinejoin="round" />
          <path d="M10 5.5v5.5M10 13.8v.3" stroke="currentColor" strokeWidth="2.2" strokeLinecap="round" />
        </>
      )}
    </svg>
  )
}
