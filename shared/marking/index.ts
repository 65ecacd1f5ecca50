/**
 * Marking of reports: read the data file (read), score it against the variant's Reference (score),
 * read typed answers (answers), and flag similar reports within an exercise (similarity).
 */
export * from './read';
export * from './score';
export * from './answers';
export * from './similarity';
