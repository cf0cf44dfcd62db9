/** /my-reports — a complainant's own reports; arrives with the report workflow. */
import { ComingSoon } from '../../components/ui/coming-soon'
import { PageHeader } from '../../components/ui/page-header'

export function Component() {
  return (
    <>
      <PageHeader title="My reports" lead={<p>Reports you send while signed in, with where each one stands.</p>} />
      <ComingSoon arrivesWith="report tracking">
        <p>Your list of reports is not built yet. Reports cannot be sent yet either; both arrive together.</p>
      </ComingSoon>
    </>
  )
}
