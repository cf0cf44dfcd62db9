/**
 * /registers/equipment — the office's antennas and instruments with their calibration; the
 * office's supervisor and administrators keep it. An administrator chooses the office.
 */
import { useState } from 'react'
import { useQuery } from '@tanstack/react-query'
import { Loading } from '@/components/ui/loading'
import { PageHeader } from '@/components/ui/page-header'
import { QueryError } from '@/components/ui/query-error'
import { SelectField } from '@/components/ui/select-field'
import { meQueryOptions } from '@/features/auth/api/get-me'
import { useEquipment } from '@/features/equipment/api/get-equipment'
import { EquipmentList } from '@/features/equipment/components/equipment-list'
import { useOffices } from '@/features/offices/api/get-offices'

function OfficeRegister({ officeId }: { officeId: string }) {
  const equipment = useEquipment(officeId)
  if (equipment.isPending) return <Loading label="Loading the register…" />
  if (equipment.isError) return <QueryError error={equipment.error} what="the register" onRetry={() => void equipment.refetch()} />
  return <EquipmentList items={equipment.data.items} officeId={officeId} canManage={equipment.data.abilities.manage} />
}

function ChooseOffice() {
  const offices = useOffices()
  const [officeId, setOfficeId] = useState('')
  if (offices.isPending) return <Loading label="Loading the offices…" />
  if (offices.isError) return <QueryError error={offices.error} what="the offices" onRetry={() => void offices.refetch()} />
  const chosen = officeId || offices.data.offices[0]?.id || ''
  return (
    <div className="flex flex-col gap-4">
      <div className="max-w-md">
        <SelectField label="Office" name="office" value={chosen} onChange={(e) => setOfficeId(e.target.value)} options={offices.data.offices.map((o) => ({ value: o.id, label: o.name }))} />
      </div>
      {chosen && <OfficeRegister officeId={chosen} />}
    </div>
  )
}

export function Component() {
  const me = useQuery(meQueryOptions())
  const user = me.data?.user ?? null
  return (
    <>
      <PageHeader
        title="Antennas and instruments"
        lead={<p>{user?.officeName ? `${user.officeName}’s` : 'Each office’s'} antennas, analysers, receivers and cables, with the antenna factors or gains and the calibration dates that measurements use.</p>}
      />
      {me.isPending && <Loading label="Loading…" />}
      {user && (user.officeId ? <OfficeRegister officeId={user.officeId} /> : <ChooseOffice />)}
    </>
  )
}
