import type { Metadata } from 'next';
import { NewPasswordForm } from '@/components/auth/new-password-form';
import { Card, CardBody, CardHeader, CardTitle } from '@/components/ui/card';

export const metadata: Metadata = { title: 'Choose a new password' };

export default async function ResetPasswordPage({ params }: { params: Promise<{ token: string }> }) {
  const { token } = await params;
  return (
    <Card>
      <CardHeader>
        <CardTitle as="h1">Choose a new password</CardTitle>
      </CardHeader>
      <CardBody className="flex flex-col gap-4">
        <p>This link works once. After saving, sign in with your e-mail address and the new password.</p>
        <NewPasswordForm token={token} endpoint="/api/password-resets/accept" doneHref="/sign-in?reset=1" />
      </CardBody>
    </Card>
  );
}
