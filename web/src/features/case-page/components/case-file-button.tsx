/**
 * "Case file (PDF)": issues the case's signed case file and saves it. Shown when the case's
 * abilities allow it; says what the file is and shows the SHA-256 that the timeline records.
 */
import { Button } from '@/components/ui/button'
import { FormAlert } from '@/components/ui/form-alert'
import { formProblem } from '@/lib/form-errors'
import type { CaseDetail } from '../api/get-case'
import { useIssueCaseFile } from '../api/issue-case-file'

export function CaseFileButton({ detail }: { detail: CaseDetail }) {
  const issue = useIssueCaseFile(detail.id)
  if (!detail.abilities.issueCaseFile) return null
  return (
    <div className="case-file-action flex flex-col items-stretch gap-2 sm:items-end">
      <Button variant="secondary" className="w-full sm:w-auto" onClick={() => issue.mutate()} disabled={issue.isPending} aria-describedby={`case-file-help-${detail.id}`}>
        {issue.isPending ? 'Signing the case file…' : 'Case file (PDF)'}
      </Button>
      <p id={`case-file-help-${detail.id}`} className="max-w-md text-sm text-ink-muted sm:text-right">
        A signed PDF of the whole case; its SHA-256 is written to the timeline.
      </p>
      {issue.isSuccess && issue.data.sha256 && (
        <p role="status" className="max-w-md break-all text-sm sm:text-right">
          Saved {issue.data.fileName} · SHA-256 <span className="font-mono">{issue.data.sha256}</span>
        </p>
      )}
      {issue.isError && <FormAlert problem={formProblem(issue.error)} />}
    </div>
  )
}
