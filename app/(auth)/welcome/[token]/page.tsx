import type { Metadata } from 'next';
import { NewPasswordForm } from '@/components/auth/new-password-form';
import { Card, CardBody, CardHeader, CardTitle } from '@/components/ui/card';

export const metadata: Metadata = { title: 'Welcome' };

export default async function WelcomePage({ params }: { params: Promise<{ token: string }> }) {
  const { token } = await params;
  return (
    <Card>
      <CardHeader>
        <CardTitle as="h1">Welcome to Brixhouse</CardTitle>
      </CardHeader>
      <CardBody className="flex flex-col gap-4">
        <p>Choose a password; then sign in with the e-mail address this invitation came to.</p>
        <NewPasswordForm token={token} endpoint="/api/invitations/accept" doneHref="/sign-in?welcome=1" />
      </CardBody>
    </Card>
  );
}
