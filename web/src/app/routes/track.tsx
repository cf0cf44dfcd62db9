/** /track — how following a report works (the link itself carries the key). */
import { Link } from 'react-router-dom'
import { PageHeader } from '@/components/ui/page-header'
import { Panel } from '@/components/ui/panel'
import { paths } from '@/lib/paths'

export function Component() {
  return (
    <div className="max-w-3xl">
      <PageHeader title="Follow a report" lead={<p>Every report has its own private tracking link, sent to you by e-mail.</p>} />
      <Panel>
        <ol className="flex list-decimal flex-col gap-3 pl-5">
          <li>When your report arrives, we e-mail you its reference and a private tracking link.</li>
          <li>Open the link on any device. It shows where your report stands: received, accepted, assigned to an engineer, under investigation, or closed with an outcome.</li>
          <li>Use the same page to add what you notice later — new times, places or recordings help the engineer find the source.</li>
          <li>We e-mail you again at each step that concerns you.</li>
        </ol>
      </Panel>
      <p className="mt-5 text-ink-muted">
        Keep the link private: anyone who has it can read the report. Lost it? With an account, your reports are listed under{' '}
        <Link to={paths.myReports.href()}>My reports</Link>.
      </p>
    </div>
  )
}
