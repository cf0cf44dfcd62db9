/** / — what Quietband does for someone suffering interference, and the three ways in. */
import { Link } from 'react-router-dom'
import { buttonClass } from '@/components/ui/button'
import { PriorityBadge } from '@/components/ui/priority-badge'
import { paths } from '@/lib/paths'

const STEPS = [
  { title: 'Received', text: 'You get a reference and your private tracking link by e-mail.' },
  { title: 'Assessed', text: 'The office sets a priority and, if others reported the same trouble, joins the reports.' },
  { title: 'Investigated', text: 'An engineer looks into it, often with measurements on site, and finds the source.' },
  { title: 'Closed', text: 'You are told the outcome: for example, the source was fixed or action was taken.' },
]

export function Component() {
  return (
    <div className="flex flex-col gap-10">
      <title>Quietband · Report harmful radio interference</title>
      <div className="grid items-start gap-8 lg:grid-cols-[minmax(0,3fr)_minmax(0,2fr)]">
      <section aria-labelledby="home-title" className="flex flex-col gap-5">
        <h1 id="home-title" className="text-4xl font-bold leading-tight">
          Radio interference? Tell the field office.
        </h1>
        <p className="text-lg leading-relaxed">
          When a radio service you rely on — a marine channel, a mobile signal, a fixed link, a broadcast station, an aircraft
          navigation aid — is drowned out, cut off or keeps dropping, report it here. An engineer at the nearest field office of the
          spectrum regulator reads every report, sets its priority by the danger and the service affected, and, where needed, goes
          out to measure the signal and find its source. You get a reference and a private link to follow your report. You do not
          need an account.
        </p>
        <div>
          <Link to={paths.report.href()} className={buttonClass('primary', 'min-h-14 px-7 text-xl')}>
            Report interference
          </Link>
        </div>
      </section>
      <section aria-labelledby="home-steps" className="rounded-panel border border-rule bg-surface p-5">
        <h2 id="home-steps" className="mb-3 text-xl font-bold">
          What happens to your report
        </h2>
        <ol className="flex flex-col gap-3">
          {STEPS.map((step, i) => (
            <li key={step.title} className="flex gap-3">
              <span aria-hidden="true" className="flex h-7 w-7 shrink-0 items-center justify-center rounded-full border-2 border-signal font-mono text-sm font-semibold text-signal">
                {i + 1}
              </span>
              <div>
                <p className="font-semibold">{step.title}</p>
                <p className="text-ink-muted">{step.text}</p>
              </div>
            </li>
          ))}
        </ol>
        <div className="mt-4 flex flex-col gap-2 border-t border-rule pt-4">
          <div>
            <PriorityBadge level={1} />
          </div>
          <p className="text-sm text-ink-muted">
            Interference to aviation, maritime distress and safety, radionavigation and emergency services is handled first.
          </p>
        </div>
      </section>
      </div>

      <div className="grid gap-5 md:grid-cols-2">
        <section aria-labelledby="home-follow" className="flex flex-col gap-3 rounded-panel border border-rule bg-surface p-5">
          <h2 id="home-follow" className="text-xl font-bold">
            Already reported?
          </h2>
          <p>
            We e-mail you a reference and a private tracking link when your report arrives. Open the link to see where it stands,
            add what you have noticed since, and read the outcome.
          </p>
          <p>
            <Link to={paths.track.href()} className="font-semibold">
              Follow a report
            </Link>
          </p>
        </section>
        <section aria-labelledby="home-staff" className="flex flex-col gap-3 rounded-panel border border-rule bg-surface p-5">
          <h2 id="home-staff" className="text-xl font-bold">
            Field office staff
          </h2>
          <p>Investigators, supervisors and administrators sign in with the account their office set up for them.</p>
          <p>
            <Link to={paths.signIn.href()} className="font-semibold">
              Staff sign-in
            </Link>
          </p>
        </section>
      </div>
    </div>
  )
}
