/** The team library on the client: the Library drawer of the parts tray, publishing, and the placing/updating edits. */
export { LibraryDrawer } from './library-drawer';
export { PublishModuleButton } from './publish-module';
export { usePublishModule, libraryQueryOptions, fetchLibraryEntry } from './api';
export { libraryStanding, standingText, type LibraryStanding } from './library-status';
export { placeFromLibrary, updateFromLibrary, libraryCopies, copiesAmong, type LibraryContent } from './library-edits';
