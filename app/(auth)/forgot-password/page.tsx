import type { Metadata } from 'next';
import Link from 'next/link';
import { ForgotPasswordForm } from '@/components/auth/forgot-password-form';
import { Card, CardBody, CardHeader, CardTitle } from '@/components/ui/card';

export const metadata: Metadata = { title: 'Forgot your password?' };

export default function ForgotPasswordPage() {
  return (
    <Card>
      <CardHeader>
        <CardTitle as="h1">Forgot your password?</CardTitle>
      </CardHeader>
      <CardBody className="flex flex-col gap-4">
        <p>Enter the e-mail address you sign in with. We will send a link to choose a new password; it works once, for an hour.</p>
        <ForgotPasswordForm />
        <Link href="/sign-in" className="inline-flex min-h-touch items-center self-start rounded-lg font-semibold text-spruce-strong underline underline-offset-4">
          Back to sign-in
        </Link>
      </CardBody>
    </Card>
  );
}
