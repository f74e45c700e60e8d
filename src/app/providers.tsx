import { QueryClientProvider } from '@tanstack/react-query';
import { useState, type ReactNode } from 'react';
import { Toaster } from 'sonner';
import { authKeys } from '../features/auth';
import { createQueryClient } from '../lib/query-client';

/** Server state (TanStack Query) and the toaster, around the whole app. */
export function Providers({ children }: { children: ReactNode }) {
  // A 401 anywhere means the session is gone: mark the user signed out, and the signed-in pages
  // send the visitor to sign in (and back afterwards).
  const [client] = useState(() => createQueryClient((qc) => qc.setQueryData(authKeys.me, null)));
  return (
    <QueryClientProvider client={client}>
      {children}
      <Toaster
        theme="dark"
        position="bottom-right"
        closeButton
        toastOptions={{
          classNames: {
            toast: '!bg-mat-800 !border !border-mat-600 !text-slate-100 !font-sans',
            description: '!text-slate-300',
            success: '[&_[data-icon]]:!text-amber-glow',
            error: '[&_[data-icon]]:!text-rose-400',
          },
        }}
      />
    </QueryClientProvider>
  );
}
