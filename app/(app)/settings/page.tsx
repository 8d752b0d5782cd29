import type { Metadata } from 'next';
import { requireRole } from '@/lib/auth/session';
import { getSettings } from '@/lib/settings';
import { SettingsForm } from '@/components/settings/settings-form';
import { Card, CardBody, CardHeader, CardTitle } from '@/components/ui/card';

export const metadata: Metadata = { title: 'Settings' };

export default async function SettingsPage() {
  const user = await requireRole(['coordinator'], { onFail: 'redirect' });
  const settings = await getSettings({ cooperativeId: user.cooperativeId });
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
    </div>
  );
}
