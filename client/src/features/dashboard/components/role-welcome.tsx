import { Link } from 'react-router-dom';
import { buttonClass } from '../../../components/ui/button';
import { Card } from '../../../components/ui/card';
import { paths } from '../../../config/paths';
import type { Role } from '@contract';

interface Step {
  text: string;
  link?: { to: string; label: string };
}

const guide: Record<Role, { lead: string; steps: Step[] }> = {
  owner: {
    lead: 'You set up the company and see how its quotes do.',
    steps: [
      {
        text: 'Add your estimators, salespeople and installers so each can sign in.',
        link: { to: paths.users, label: 'Manage users' },
      },
      {
        text: 'Fill in the price book and the equipment you sell; every takeoff is priced from it.',
        link: { to: paths.priceBook, label: 'Open price book' },
      },
      { text: 'Once proposals go out, win rate and average ticket appear under Reports.' },
    ],
  },
  estimator: {
    lead: 'You turn a walk-through into a system, a material list and a priced proposal.',
    steps: [
      {
        text: 'Open a job to check its room loads and choose equipment for each zone.',
        link: { to: paths.jobs, label: 'Go to jobs' },
      },
      { text: 'Set each line-set run, review the takeoff and labor, then issue the proposal.' },
    ],
  },
  salesperson: {
    lead: 'You walk the home, room by room, and leave with a first price.',
    steps: [
      {
        text: 'Start a job for the customer and record each room as you go; it saves on the phone if the signal drops.',
        link: { to: paths.jobs, label: 'Go to jobs' },
      },
      { text: 'Note the customer’s comfort wishes so the estimator can shape the options.' },
    ],
  },
  installer: {
    lead: 'You get the job packet and keep the commissioning record.',
    steps: [
      {
        text: 'Open your jobs to see equipment, line-set runs, the charge plan and materials.',
        link: { to: paths.jobs, label: 'Go to jobs' },
      },
      { text: 'Record the pressure test, evacuation reading and refrigerant added on site.' },
    ],
  },
};

export function RoleWelcome({ role, firstName }: { role: Role; firstName: string }) {
  const { lead, steps } = guide[role];
  return (
    <div className="flex flex-col gap-6">
      <div>
        <h1 className="text-2xl font-semibold text-ink-900">Hello, {firstName}</h1>
        <p className="mt-1 text-lg text-muted">{lead}</p>
      </div>
      <Card title="What to do next">
        <ol className="flex flex-col gap-4">
          {steps.map((s, i) => (
            <li key={s.text} className="flex gap-3">
              <span
                aria-hidden="true"
                className="flex size-8 shrink-0 items-center justify-center rounded-full bg-ink-100 font-semibold text-ink-800"
              >
                {i + 1}
              </span>
              <div className="flex flex-col items-start gap-2">
                <p>{s.text}</p>
                {s.link ? (
                  <Link to={s.link.to} className={buttonClass('secondary')}>
                    {s.link.label}
                  </Link>
                ) : null}
              </div>
            </li>
          ))}
        </ol>
      </Card>
    </div>
  );
}
