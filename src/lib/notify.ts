import { toast } from 'sonner';
import { errorMessage } from './api-client';

/** A toast for a failed action, in the server's words. */
export function notifyError(err: unknown, title?: string): void {
  toast.error(title ?? errorMessage(err), title ? { description: errorMessage(err) } : undefined);
}

/** A toast for an action that worked. */
export function notifySuccess(message: string, description?: string): void {
  toast.success(message, description ? { description } : undefined);
}
