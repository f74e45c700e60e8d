/**
 * The full check of a board file through zod (shared/board parseBoardFile), for the files the quick
 * check (board-file.ts) is not sure of — that is, for invalid ones, whose first problem it words. The build
 * (scripts/build-cli.mjs) makes it a file of its own, dist-cli/board-check.cjs, and puts in its place in
 * the command bundles a function that loads that file on its first call, so that a call with a valid file
 * never loads zod.
 */
export { parseBoardFile } from '../../shared/board';
