import type { Metadata } from 'next';
import { requireContext } from '@/lib/server/context';
import { getSettings } from '@/lib/settings/service';
import { SettingsForm } from '@/components/settings/settings-form';
import { Card, CardBody, CardHeader, CardTitle } from '@/components/ui/card';
import { listDisplayLinks } from '@/lib/display/service';
import { DisplayLinksManager } from '@/components/display/display-links-manager';

export const metadata: Metadata = { title: 'Settings' };

export default async function SettingsPage() {
  const ctx = await requireContext({ roles: ['coordinator'], onFail: 'redirect' });
  const [settings, displayLinks] = await Promise.all([
    getSettings(ctx),
    listDisplayLinks(ctx),
  ]);
  return (
    <div className="flex flex-col gap-6">
      <div>
        <h1 className="text-3xl font-bold">Settings</h1>
        <p className="text-slate-muted">Booking rules for the evaporator and how long sap keeps.</p>
      </div>
      <Card>
        <CardHeader>
          <CardTitle>Booking and sap rules</CardTitle>
        </CardHeader>
        <CardBody>
          <SettingsForm initial={settings} />
        </CardBody>
      </Card>
      <Card>
        <CardHeader>
          <CardTitle>Sugarhouse display links</CardTitle>
          <p className="text-slate-muted">A screen in the sugarhouse shows the live Boil queue through one of these links, without anyone signing in on it.</p>
        </CardHeader>
        <CardBody>
          <DisplayLinksManager initial={displayLinks} />
        </CardBody>
      </Card>
    </div>
  );
}
