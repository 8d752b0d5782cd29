import type { Metadata } from 'next';
import { Suspense } from 'react';
import { redirect } from 'next/navigation';
import { optionalContext } from '@/lib/server/context';
import { SignInForm } from '@/components/auth/sign-in-form';
import { Card, CardBody, CardHeader, CardTitle } from '@/components/ui/card';

export const metadata: Metadata = { title: 'Sign in' };

export default async function SignInPage() {
  if (await optionalContext()) redirect('/home');
  return (
    <Card>
      <CardHeader>
        <CardTitle as="h1">Sign in to your sugarhouse</CardTitle>
      </CardHeader>
      <CardBody>
        <Suspense>
          <SignInForm />
        </Suspense>
      </CardBody>
    </Card>
  );
}
