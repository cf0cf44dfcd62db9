/**
 * /admin/offices — the field offices, and one office's settings at a time (targets, time zone,
 * retention): a regulator has a handful of offices, a test database hundreds, and every office's
 * forms at once would be a long page of forms for both.
 */
import { useState } from 'react'
import { Loading } from '@/components/ui/loading'
import { PageHeader } from '@/components/ui/page-header'
import { QueryError } from '@/components/ui/query-error'
import { SelectField } from '@/components/ui/select-field'
import { useOffices } from '@/features/offices/api/get-offices'
import { OfficesTable } from '@/features/offices/components/offices-table'
import { OfficeTargetsPanels } from '@/features/offices/components/office-targets-panels'
import { RetentionPanels } from '@/features/retention/components/retention-panels'
import { RetentionDryRun } from '@/features/retention/components/retention-dry-run'

export function Component() {
  const offices = useOffices()
  const [chosenId, setChosenId] = useState<string | null>(null)
  const all = offices.data?.offices ?? []
  const chosen = all.find((o) => o.id === chosenId) ?? all[0]
  return (
    <>
      <PageHeader title="Offices" lead={<p>Each office answers reports from its region, against its own response targets per harm class.</p>} />
      <div className="flex flex-col gap-6">
        {offices.isPending && <Loading label="Loading offices…" />}
        {offices.isError && <QueryError error={offices.error} what="offices" onRetry={() => void offices.refetch()} />}
        {offices.data && <OfficesTable offices={all} />}
        {chosen && (
          <>
            {all.length > 1 && (
              <div className="max-w-md">
                <SelectField label="Settings of the office" name="settings-office" options={all.map((o) => ({ value: o.id, label: o.name }))} value={chosen.id} onChange={(e) => setChosenId(e.target.value)} />
              </div>
            )}
            <OfficeTargetsPanels key={`targets-${chosen.id}`} offices={[chosen]} />
            <RetentionPanels key={`retention-${chosen.id}`} offices={[chosen]} />
          </>
        )}
        <RetentionDryRun />
      </div>
    </>
  )
}
