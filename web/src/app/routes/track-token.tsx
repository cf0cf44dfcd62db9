/** /track/:token — the complainant's tracking page; arrives with the report workflow. */
import { PageHeader } from '../../components/ui/page-header'
import { ComingSoon } from '../../components/ui/coming-soon'

export function Component() {
  return (
    <>
      <PageHeader title="Your report" />
      <ComingSoon arrivesWith="report tracking">
        <p>The tracking page is not ready yet. Soon this link will show your report's progress, let you add information and show the outcome.</p>
        <p>Keep the e-mail with this link: it will work once tracking is switched on.</p>
      </ComingSoon>
    </>
  )
}
