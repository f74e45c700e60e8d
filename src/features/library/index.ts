/** The team library on the client: the Library drawer of the parts tray, publishing, and the placing/updating edits. */
export { LibraryDrawer } from './library-drawer';
export { usePublishModule, libraryQueryOptions, fetchLibraryEntry } from './api';
export { placeFromLibrary, updateFromLibrary, libraryCopies, type LibraryContent } from './library-edits';
