import { onlineManager, type QueryClient } from '@tanstack/react-query';
import type { LoaderFunctionArgs } from 'react-router-dom';
import { QueryWidgetBoundary } from '../../components/errors/query-widget-boundary';
import { Card } from '../../components/ui/card';
import { PageHeader } from '../../components/ui/page-header';
import { companySettingsQueryOptions, lossReasonsQueryOptions } from '../../entities/job/queries';
import { DesignDefaultsForm } from '../../features/company-settings/components/design-defaults-form';
import { proposalDetailsQueryOptions } from '../../features/company-settings/api/proposal-details';
import { LogoField } from '../../features/company-settings/components/logo-field';
import { LossReasonsForm } from '../../features/company-settings/components/loss-reasons-form';
import { ProposalDetailsForm } from '../../features/company-settings/components/proposal-details-form';
import { UnitSystemForm } from '../../features/company-settings/components/unit-system-form';
import { requireArea } from '../guards';
import { ensureHeld } from '../../lib/offline/online';

export const clientLoader =
  (queryClient: QueryClient) =>
  async ({ request }: LoaderFunctionArgs) => {
    await requireArea(queryClient, request, 'settings');
    // The settings are edited here, so read what the server holds now, not a copy the device saved
    // before the last save (the saved cache is written a beat later); with no signal the copy stands.
    const settings = companySettingsQueryOptions();
    if (onlineManager.isOnline()) await queryClient.prefetchQuery({ ...settings, staleTime: 0 });
    // Nothing held and no signal: "No signal" in words at once, not a fetch paused until the signal is back.
    await ensureHeld(queryClient, settings.queryKey, () => queryClient.ensureQueryData(settings));
    // What every proposal carries: read while the page loads; its cards wait for it on their own.
    const details = proposalDetailsQueryOptions();
    if (onlineManager.isOnline()) void queryClient.prefetchQuery({ ...details, staleTime: 0 });
    const reasons = lossReasonsQueryOptions();
    if (onlineManager.isOnline()) void queryClient.prefetchQuery({ ...reasons, staleTime: 0 });
    return null;
  };

export default function CompanySettingsRoute() {
  return (
    <>
      <PageHeader
        title="Company settings"
        lead="The units your people work in, the design conditions every new job starts from, what every proposal carries, and the reasons a job is marked lost with. A job can still change any design value for its own site."
      />
      <div className="flex flex-col gap-6">
        <Card title="Units">
          <QueryWidgetBoundary name="the units">
            <UnitSystemForm />
          </QueryWidgetBoundary>
        </Card>
        <Card title="Design defaults">
          <QueryWidgetBoundary name="the design defaults">
            <DesignDefaultsForm />
          </QueryWidgetBoundary>
        </Card>
        <Card title="On every proposal">
          <QueryWidgetBoundary name="the proposal details">
            <ProposalDetailsForm />
          </QueryWidgetBoundary>
        </Card>
        <Card title="Logo">
          <QueryWidgetBoundary name="the logo">
            <LogoField />
          </QueryWidgetBoundary>
        </Card>
        <Card title="Reasons a job is lost">
          <QueryWidgetBoundary name="the loss reasons">
            <LossReasonsForm />
          </QueryWidgetBoundary>
        </Card>
      </div>
    </>
  );
}
