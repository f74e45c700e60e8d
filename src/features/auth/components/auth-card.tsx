import type { ReactNode } from 'react';
import { Card, CardBody } from '../../../components/ui/card';

/** The frame around every account form: a title, a line of context, the form, and links below. */
export function AuthCard({ title, subtitle, children, footer }: { title: string; subtitle?: ReactNode; children: ReactNode; footer?: ReactNode }) {
  return (
    <Card>
      <CardBody className="flex flex-col gap-5 px-6 py-6">
        <div>
          <h1 className="text-lg font-semibold text-slate-100">{title}</h1>
          {subtitle && <p className="mt-1 text-sm text-slate-400">{subtitle}</p>}
        </div>
        {children}
        {footer && <div className="border-t border-mat-700 pt-4 text-sm text-slate-400">{footer}</div>}
      </CardBody>
    </Card>
  );
}
