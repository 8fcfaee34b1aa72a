import { Link } from 'react-router-dom';
import { buttonClass } from '../../../components/ui/button';
import { Card } from '../../../components/ui/card';
import { paths } from '../../../config/paths';
import type { Role } from '@contract';

interface Step {
  text: string;
  link?: { to: string; label: string };
}

/** What each role can do in Gaugeline today, and nothing it cannot do yet. */
const guide: Record<Role, { lead: string; steps: Step[] }> = {
  owner: {
    lead: 'You set up the company: its people, its price book and the equipment it sells.',
    steps: [
      {
        text: 'Add your estimators, salespeople and installers so each can sign in.',
        link: { to: paths.users, label: 'Manage users' },
      },
      {
        text: 'Fill in the price book and the equipment catalog, by hand or from a CSV file.',
        link: { to: paths.priceBook, label: 'Open price book' },
      },
      {
        text: 'Open any job to see its walk-through, room loads and priced options.',
        link: { to: paths.jobs, label: 'Go to jobs' },
      },
    ],
  },
  estimator: {
    lead: 'You check a walk-through’s loads and shape the options the customer will choose from.',
    steps: [
      {
        text: 'Open a job to check its rooms and the loads worked out hour by hour, with a printable summary.',
        link: { to: paths.jobs, label: 'Go to jobs' },
      },
      {
        text: 'From a job’s loads page, “Options and price” sets up to three priced options: zones, equipment, takeoff and price.',
      },
    ],
  },
  salesperson: {
    lead: 'You walk the home room by room; it saves on the phone if the signal drops.',
    steps: [
      {
        text: 'Start a job for the customer (or pick one you already have) and record each room as you go.',
        link: { to: paths.jobs, label: 'Go to jobs' },
      },
      { text: 'Each room’s loads show as you type; the loads summary prints for the homeowner.' },
    ],
  },
  installer: {
    lead: 'You read the jobs assigned to you.',
    steps: [
      {
        text: 'Open your jobs to read each one’s site, rooms with their sizes, notes and photos.',
        link: { to: paths.jobs, label: 'Go to jobs' },
      },
      {
        text: 'The equipment catalog lists the models and materials the company uses.',
        link: { to: paths.priceBook, label: 'Open the catalog' },
      },
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
