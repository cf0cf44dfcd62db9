/** /report — the report form arrives with the intake feature; the route exists now. */
import { PageHeader } from '../../components/ui/page-header'
import { ComingSoon } from '../../components/ui/coming-soon'

export function Component() {
  return (
    <>
      <PageHeader title="Report interference" lead={<p>Tell us what you hear or lose, where, and since when.</p>} />
      <ComingSoon arrivesWith="the report form">
        <p>The report form is not ready yet. Soon you will be able to describe the interference here, mark where it happens on a map and attach recordings or photos.</p>
        <p>No reports can be sent from this page for now.</p>
      </ComingSoon>
    </>
  )
}
