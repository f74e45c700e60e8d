/** Class mode: share links for guests (the owner's class panel with QR code), the guests' join, the audience, lead / follow and explain. */
export { ClassPanel } from './components/class-panel';
export { LinkQr } from './components/link-qr';
export { LessonPanel } from './components/lesson-panel';
export { useAudience, useHands, type RaisedHand } from './use-audience';
export { useLesson, type Lesson } from './use-lesson';
export { shareInfoQueryOptions, shareLinksQueryOptions, useJoinShare } from './api';
