/** Class mode: share links for guests (the owner's class panel with QR code), the guests' join, the audience, lead / follow and explain. */
import { lazyNamed } from '../../lib/lazy-named';

// The panels and pages below are chunks of their own, loaded on first render (inside a Suspense boundary):
// the main script, which runs before a board's canvas draws, does not hold them.
export const ClassPanel = lazyNamed(() => import('./components/class-panel'), 'ClassPanel');
export const LinkQr = lazyNamed(() => import('./components/link-qr'), 'LinkQr');
export const LessonPanel = lazyNamed(() => import('./components/lesson-panel'), 'LessonPanel');
export { useAudience, useHands, type RaisedHand } from './use-audience';
export { useLesson, type Lesson } from './use-lesson';
export { shareInfoQueryOptions, shareLinksQueryOptions, useJoinShare } from './api';
