/**
 * /admin/offices — the field offices, and one office's settings at a time (targets, time zone,
 * retention): a regulator has a handful of offices, a test database hundreds, and every office's
 * forms at once would be a long page of forms for both.
 */
import { Link, useLocation, useSearchParams } from 'react-router-dom'
import type { AreaWarning } from '@shared/schemas/offices'
import { buttonClass } from '@/components/ui/button'
import { Loading } from '@/components/ui/loading'
import { PageHeader } from '@/components/ui/page-header'
import { Notice } from '@/components/ui/notice'
import { QueryError } from '@/components/ui/query-error'
import { SelectField } from '@/components/ui/select-field'
import { useOffices } from '@/features/offices/api/get-offices'
import { OfficesTable } from '@/features/offices/components/offices-table'
import { OfficeTargetsPanels } from '@/features/offices/components/office-targets-panels'
import { AreaWarnings } from '@/features/offices/components/area-warnings'
import { paths } from '@/lib/paths'
import { RetentionPanels } from '@/features/retention/components/retention-panels'
import { RetentionDryRun } from '@/features/retention/components/retention-dry-run'

/** What the office editor hands this page after a save (router state): the office and the area's warnings. */
export interface OfficeSavedState {
  saved: { name: string; created: boolean; warnings: AreaWarning[] }
}

export function Component() {
  const offices = useOffices()
  // the office whose settings show is in the address (?officeId=), so the editor can come back to it
  const [search, setSearch] = useSearchParams()
  const saved = (useLocation().state as OfficeSavedState | null)?.saved
  const all = offices.data?.offices ?? []
  const chosen = all.find((o) => o.id === search.get('officeId')) ?? all[0]
  return (
    <>
      <PageHeader title="Offices" lead={<p>Each office answers the reports filed inside its area (outside every area, the nearest office), against its own response targets per harm class.</p>} />
      <div className="flex flex-col gap-6">
        {saved && (
          <Notice tone={saved.warnings.length ? 'caution' : 'ok'} title={`${saved.created ? 'Created' : 'Saved'}: ${saved.name}.`} live>
            {saved.warnings.length === 0 && <p>Reports are routed by its area from now on.</p>}
          </Notice>
        )}
        {saved && <AreaWarnings title="About its area" warnings={saved.warnings} />}
        {offices.data && (
          <p>
            <Link to={paths.adminOfficeNew.href()} className={buttonClass('secondary')}>
              New office
            </Link>
          </p>
        )}
        {offices.isPending && <Loading label="Loading offices…" />}
        {offices.isError && <QueryError error={offices.error} what="offices" onRetry={() => void offices.refetch()} />}
        {offices.data && <OfficesTable offices={all} />}
        {chosen && (
          <>
            {all.length > 1 && (
              <div className="max-w-md">
                <SelectField
                  label="Settings of the office"
                  name="settings-office"
                  options={all.map((o) => ({ value: o.id, label: o.name }))}
                  value={chosen.id}
                  onChange={(e) => setSearch({ officeId: e.target.value }, { replace: true })}
                />
              </div>
            )}
            {chosen.abilities.edit && (
              <p>
                <Link to={paths.adminOfficeEdit.href(chosen.id)} className={buttonClass('secondary')}>
                  Edit details and area of {chosen.name}
                </Link>
              </p>
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
