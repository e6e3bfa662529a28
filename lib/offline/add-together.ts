// Adds rows to several tables of the bench database in ONE native IndexedDB transaction: all of
// them are stored, or none. An entry's reading and its outbox row go this way because a Dexie
// transaction costs the tablet a few milliseconds of main-thread work per Enter (promise zones,
// middleware) before the verdict can paint, and these are plain inserts that need none of it.
// Dexie's observers are then told with its documented "storagemutated" event, so the screens'
// live reads (hooks/use-dexie-query.ts) and other tabs see the rows as if Dexie had written them.
import Dexie, { RangeSet } from "dexie";

export interface Add {
  table: string;
  row: object;
  /** The row's primary key, for the change notice. */
  key: string;
  /** Indexed fields of the row, by index name, for the change notice. */
  indexed?: Record<string, string | number>;
}

function changeNotice(db: Dexie, adds: Add[]) {
  const parts: Record<string, RangeSet> = {};
  for (const a of adds) {
    const prefix = `idb://${db.name}/${a.table}/`;
    (parts[prefix] ??= new RangeSet()).addKey(a.key);
    for (const [index, value] of Object.entries(a.indexed ?? {}))
      (parts[prefix + index] ??= new RangeSet()).addKey(value);
  }
  return parts;
}

/** The same writes through Dexie: when the database is not open yet (or was closed for an upgrade). */
function withDexie(db: Dexie, adds: Add[]): Promise<void> {
  return db
    .transaction("rw", [...new Set(adds.map((a) => a.table))], () =>
      Promise.all(adds.map((a) => db.table(a.table).add(a.row))),
    )
    .then(() => undefined);
}

export function addTogether(db: Dexie, adds: Add[]): Promise<void> {
  let tx: IDBTransaction;
  try {
    if (!db.isOpen()) return withDexie(db, adds);
    tx = db.backendDB().transaction([...new Set(adds.map((a) => a.table))], "readwrite");
  } catch {
    return withDexie(db, adds); // closed underneath us (another tab upgraded the schema): Dexie reopens it
  }
  return new Promise<void>((resolve, reject) => {
    tx.oncomplete = () => {
      resolve();
      // After the writer has heard its rows are safe; re-reads follow on their own tasks.
      setTimeout(() => Dexie.on("storagemutated").fire(changeNotice(db, adds)), 0);
    };
    tx.onabort = () => reject(tx.error ?? new Error("The tablet's storage did not save the reading"));
    try {
      for (const a of adds) tx.objectStore(a.table).add(a.row);
      // Nothing else goes in: commit now rather than after the page has handled each add's
      // success event, which waits behind the verdict's paint on a busy tablet.
      tx.commit?.();
    } catch (err) {
      tx.onabort = null;
      tx.abort();
      reject(err);
    }
  });
}
