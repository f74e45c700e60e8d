/** Class mode: share links for guests (the owner's class panel with QR code), the guests' join, the audience. */
export { ClassPanel } from './components/class-panel';
export { LinkQr } from './components/link-qr';
export { useAudience } from './use-audience';
export { shareInfoQueryOptions, shareLinksQueryOptions, useJoinShare } from './api';
