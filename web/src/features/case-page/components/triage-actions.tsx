/** The supervisor's triage moves on the case page, each shown only when `abilities` allows it. */
import { Block, FoldedAction } from './action-form'
import { useCaseActionContext } from './case-action-context'
import { useTransferOffices } from '../api/get-transfer-offices'
import { AssignForm } from './assign-form'
import { DismissForm } from './dismiss-form'
import { MergeForm } from './merge-form'
import { TransferForm } from './transfer-form'
import { TriageForm } from './triage-form'

export function TriageActions() {
  const { detail } = useCaseActionContext()
  const a = detail.abilities
  const destinations = useTransferOffices(detail.id, a.transfer).data ?? []
  // Transfer only where there is another office to send the report to.
  const canTransfer = a.transfer && destinations.length > 0
  return (
    <>
      {a.triage && <Block><TriageForm /></Block>}
      {a.assign && !detail.investigatorId && <Block><AssignForm /></Block>}
      {a.assign && detail.investigatorId && (
        <Block>
          <FoldedAction summary="Reassign to another investigator">
            <AssignForm headingless />
          </FoldedAction>
        </Block>
      )}
      {(a.merge || a.dismiss || canTransfer) && (
        <Block>
          <div className="flex flex-col gap-2">
            {a.merge && (
              <FoldedAction summary="Merge into an open case">
                <MergeForm />
              </FoldedAction>
            )}
            {a.dismiss && (
              <FoldedAction summary="Close at triage">
                <DismissForm />
              </FoldedAction>
            )}
            {canTransfer && (
              <FoldedAction summary="Transfer to another office">
                <TransferForm destinations={destinations} />
              </FoldedAction>
            )}
          </div>
        </Block>
      )}
    </>
  )
}
