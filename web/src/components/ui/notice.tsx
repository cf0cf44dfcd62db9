/**
 * A boxed message. Tone is carried by a left bar, a word and a sign, never by colour alone.
 * `live` makes it an alert region (announced when it appears).
 */
import type { ReactNode } from 'react'
import { Sign } from './sign'

type Tone = 'info' | 'ok' | 'caution' | 'danger'

const TONES: Record<Tone, { box: string; sign: string }> = {
  info: { box: 'border-signal bg-signal-soft', sign: 'text-signal' },
  ok: { box: 'border-ok bg-ok-soft', sign: 'text-ok' },
  caution: { box: 'border-caution bg-caution-soft', sign: 'text-caution' },
  danger: { box: 'border-danger bg-danger-soft', sign: 'text-danger' },
}

export function Notice({ tone = 'info', title, children, live = false }: { tone?: Tone; title?: string; children?: ReactNode; live?: boolean }) {
  const t = TONES[tone]
  return (
    <div role={live ? 'alert' : undefined} className={`flex gap-3 rounded-control border-l-4 px-4 py-3 text-ink ${t.box}`}>
      <span className={t.sign}>
        <Sign kind={tone} />
      </span>
      <div className="flex flex-col gap-1">
        {title && <p className="font-semibold">{title}</p>}
        {children}
      </div>
    </div>
  )
}
