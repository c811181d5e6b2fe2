import { Foundation1764633600000 } from './1764633600000-Foundation';

/** Every migration, oldest first. Add new ones at the end. */
export const migrations = [Foundation1764633600000];
