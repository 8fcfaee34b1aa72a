import type { CustomerProposalView } from '@contract';
import { Alert } from '../../../components/ui/alert';
import { errorMessage } from '../../../lib/api-error';
import { useChooseOption } from '../api/choose-option';
import { useCustomerProposal } from '../api/get-customer-proposal';
import { AfterChoice } from './after-choice';
import { ChangesSince } from './changes-since';
import { usDate } from './format';
import { HomeLoads } from './home-loads';
import { OptionCard } from './option-card';
import { useIsSigned } from '../signing';
import { ProposalPdfLink } from './proposal-pdf-link';

const COLUMNS: Record<number, string> = { 1: 'lg:grid-cols-1 lg:max-w-xl', 2: 'lg:grid-cols-2', 3: 'lg:grid-cols-3' };

function Header({ view }: { view: CustomerProposalView }) {
  const s = view.site;
  const place = [
    [s.street, s.unit].filter(Boolean).join(' '),
    s.city,
    [s.region, s.postalCode].filter(Boolean).join(' '),
  ]
    .filter(Boolean)
    .join(', ');
  return (
    <header className="bg-ink-900 pb-6 pt-8 text-white">
      <div className="mx-auto max-w-6xl px-4">
        <p className="text-base font-semibold text-ink-100">{view.company.name}</p>
        <h1 className="mt-1 text-2xl font-semibold sm:text-3xl">Your proposal, {view.customer.name}</h1>
        <p className="mt-1 text-base text-ink-100">{place}</p>
        <p className="mt-1 text-sm text-ink-200">
          Version {view.version.number} · {usDate(view.version.issuedAt)}
        </p>
      </div>
    </header>
  );
}

function Contact({ view }: { view: CustomerProposalView }) {
  const c = view.company;
  return (
    <footer className="border-t border-line bg-white py-6">
      <div className="mx-auto max-w-6xl px-4 text-base">
        <p className="font-semibold text-ink-900">Questions? {c.name}</p>
        {c.phone ? (
          <p>
            Phone:{' '}
            <a className="font-semibold text-ink-800 underline" href={`tel:${c.phone.replace(/[^0-9+]/g, '')}`}>
              {c.phone}
            </a>
          </p>
        ) : null}
        {c.email ? (
          <p>
            E-mail:{' '}
            <a className="font-semibold text-ink-800 underline" href={`mailto:${c.email}`}>
              {c.email}
            </a>
          </p>
        ) : null}
        {c.address ? <p className="text-muted">{c.address}</p> : null}
        {c.licence ? <p className="text-sm text-muted">{c.licence}</p> : null}
      </div>
    </footer>
  );
}

function TextFold({ title, text }: { title: string; text: string }) {
  if (!text.trim()) return null;
  return (
    <details className="rounded-lg border border-line bg-white">
      <summary className="min-h-touch cursor-pointer px-4 py-3 text-base font-semibold text-ink-800">{title}</summary>
      <p className="whitespace-pre-line px-4 pb-4 text-base">{text}</p>
    </details>
  );
}

/** The customer's page: phone first; the options side by side from a wide screen, stacked on a phone. */
export function CustomerProposalPage({ proposalId }: { proposalId: string }) {
  const { data: view } = useCustomerProposal(proposalId);
  const choose = useChooseOption(proposalId);
  const signed = useIsSigned(proposalId, view.chosen?.position ?? null);
  const count = view.options.length;
  return (
    <div className="min-h-dvh bg-paper">
      <Header view={view} />
      <main className="mx-auto flex max-w-6xl flex-col gap-6 px-4 py-6">
        {view.changes ? <ChangesSince changes={view.changes} /> : null}
        <section aria-labelledby="options-heading">
          <h2 id="options-heading" className="text-xl font-semibold text-ink-900">
            {count > 1 ? `Your ${count} options` : 'What we propose'}
          </h2>
          <p className="mt-1 text-base text-muted">
            {signed
              ? 'You signed for the option marked below.'
              : count > 1
                ? 'Compare them and choose the one you want.'
                : 'Read it through and choose it to go ahead.'}
          </p>
          {choose.isError ? (
            <div className="mt-3">
              <Alert tone="danger" title="Your choice was not saved">
                {errorMessage(choose.error)}
              </Alert>
            </div>
          ) : null}
          <div className={`mt-4 grid grid-cols-1 gap-4 ${COLUMNS[count] ?? ''}`}>
            {view.options.map((o) => (
              <OptionCard
                key={o.position}
                option={o}
                chosen={view.chosen?.position === o.position}
                anyChosen={view.chosen !== null}
                signed={signed}
                busy={choose.isPending && choose.variables === o.position}
                onChoose={() => choose.mutate(o.position)}
              />
            ))}
          </div>
        </section>
        {view.chosen ? <AfterChoice view={view} signed={signed} /> : null}
        <HomeLoads loads={view.loads} />
        <section
          aria-labelledby="pdf-heading"
          className="rounded-lg border border-line bg-white p-4 shadow-card sm:p-6"
        >
          <h2 id="pdf-heading" className="text-xl font-semibold text-ink-900">
            Keep a copy
          </h2>
          <p className="mb-3 mt-1 text-base text-muted">The same proposal as a PDF, with every detail and the terms.</p>
          <ProposalPdfLink proposalId={proposalId} ready={view.pdfReady} />
        </section>
        <TextFold title="Terms" text={view.terms} />
        <TextFold title="Warranty" text={view.warranty} />
        {view.cautions.length ? (
          <details className="rounded-lg border border-line bg-white">
            <summary className="min-h-touch cursor-pointer px-4 py-3 text-base font-semibold text-ink-800">
              Safety and code notes
            </summary>
            <ul className="list-disc space-y-1 px-4 pb-4 pl-9 text-base">
              {view.cautions.map((c, i) => (
                <li key={`${i}-${c}`}>{c}</li>
              ))}
            </ul>
          </details>
        ) : null}
      </main>
      <Contact view={view} />
    </div>
  );
}
