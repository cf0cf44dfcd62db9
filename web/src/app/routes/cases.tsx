/** /cases — the office's full case list; arrives with the case workflow. */
import { ComingSoon } from '../../components/ui/coming-soon'
import { PageHeader } from '../../components/ui/page-header'

export function Component() {
  return (
    <>
      <PageHeader title="Cases" lead={<p>Every case of your office, open and closed, to search and filter.</p>} />
      <ComingSoon arrivesWith="the case workflow">
        <p>The case list is not built yet.</p>
      </ComingSoon>
    </>
  )
}
