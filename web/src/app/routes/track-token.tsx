/** /track/:token — the complainant's page for one report, opened from the e-mailed link. */
import { useParams } from 'react-router-dom'
import { ComplainantReportScreen } from '@/features/tracking/components/complainant-report-screen'

export function Component() {
  const { token = '' } = useParams()
  return (
    <div className="max-w-3xl">
      <ComplainantReportScreen source={{ kind: 'token', token }} />
    </div>
  )
}
