/** The admins' outbox: the mail the server has sent, as a list and one message at a time. */
export { outboxMessageQueryOptions, outboxQueryOptions } from './api';
export { AdminsOnly } from './components/admins-only';
export { MessageView } from './components/message-view';
export { OutboxTable } from './components/outbox-table';
