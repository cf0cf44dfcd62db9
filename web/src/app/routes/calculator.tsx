/** /calculator — the quick calculator: the estimate forms without a case; nothing is stored. */
import { PageHeader } from '@/components/ui/page-header'
import { QuickCalculator } from '@/features/estimates/components/quick-calculator'

export function Component() {
  return (
    <div className="flex min-w-0 flex-col">
      <PageHeader title="Quick calculator" lead="Estimates without a case: try a figure in the field, check a limit, share the link." />
      <QuickCalculator />
    </div>
  )
}
