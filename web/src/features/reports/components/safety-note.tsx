/** Shown as soon as a safety service is chosen: who comes first, and what to do in danger. */
import { Notice } from '@/components/ui/notice'

export function SafetyNote() {
  return (
    <Notice tone="caution" title="Safety-of-life reports are handled first.">
      <p>If anyone is in immediate danger, call the emergency services now. This form does not alert them.</p>
    </Notice>
  )
}
