import "fake-indexeddb/auto";
import { afterEach, describe, expect, it, vi } from "vitest";
import { DeviceDb, ensureMeta, getMeta, getUserDb, releaseUserDb, userDbName } from "@/lib/sync/client/db";
import { forgetCurrentIdentity, readCurrentIdentity, rememberIdentity } from "@/lib/sync/client/identity";
import { createLocal } from "@/lib/sync/client/mutate";
import { pushAll } from "@/lib/sync/client/push";
import { signOutWithCheck } from "@/lib/sync/client/react";
import { unsyncedWarning } from "@/lib/sync/client/words";
import { SYNC_SCHEMA_VERSION } from "@/lib/sync/protocol";
import { FakeServer } from "./fake-server";
import { cleanupDbs, freshDb, placementValues, project, PROJECT_ID } from "./helpers";

afterEach(cleanupDbs);

const alice = { id: "alice-0001", name: "Alice Moreno", email: "alice@example.com", isAdmin: false };
const bob = { id: "bob-0002", name: "Bob Tran", email: "bob@example.com", isAdmin: false };

describe("one database per user", () => {
  it("a second user's database never contains the first user's outbox, and never sends it", async () => {
    const a = await freshDb("alice");
    const b = await freshDb("bob");
    expect(a.name).not.toBe(b.name);
    expect(a.name).toBe(userDbName(a.userId));
    await createLocal(a, "placements", PROJECT_ID, placementValues({ element: "Alice's wall" }));
    await createLocal(a, "placements", PROJECT_ID, placementValues({ element: "Alice's slab" }));

    expect(await b.outbox.count()).toBe(0);
    expect(await b.records("placements").count()).toBe(0);
    const server = new FakeServer([project()]);
    expect(await pushAll(b, { fetch: server.fetch })).toEqual({ kind: "idle" });
    expect(server.pushes).toHaveLength(0);
    // Each user's database has its own client id and mutation ids.
    expect(await getMeta(a, "clientId")).not.toBe(await getMeta(b, "clientId"));
    const { mutationId } = await createLocal(b, "placements", PROJECT_ID, placementValues());
    expect(mutationId).toBe(1);
  });

  it("the client id is made once per device and user and survives reopening", async () => {
    const db = await freshDb();
    const clientId = await getMeta(db, "clientId");
    releaseUserDb(db.userId);
    const again = getUserDb(db.userId);
    await ensureMeta(again, SYNC_SCHEMA_VERSION);
    expect(await getMeta(again, "clientId")).toBe(clientId);
  });

  it("a changed local schema version drops the cursor (next pull resets) and keeps the outbox", async () => {
    const db = await freshDb();
    await createLocal(db, "placements", PROJECT_ID, placementValues());
    await db.meta.put({ key: "cursor", value: { [PROJECT_ID]: 40 } });
    await ensureMeta(db, SYNC_SCHEMA_VERSION + 1);
    expect(await getMeta(db, "cursor")).toBeNull();
    expect(await db.outbox.count()).toBe(1);
  });
});

describe("identity on the device", () => {
  it("remembers the signed-in person and forgets only on sign-out", async () => {
    const device = new DeviceDb();
    await rememberIdentity(alice, device);
    expect(await readCurrentIdentity(device)).toMatchObject(alice);
    await rememberIdentity(bob, device);
    expect(await readCurrentIdentity(device)).toMatchObject(bob);
    await forgetCurrentIdentity(device);
    expect(await readCurrentIdentity(device)).toBeNull();
    expect(await device.identities.count()).toBe(2);
    device.close();
    await device.delete();
  });

  it("signing out with unsynced changes says so, and keeps them for the next sign-in", async () => {
    const db = await freshDb("carol");
    await rememberIdentity({ ...alice, id: db.userId });
    for (let i = 0; i < 3; i += 1) await createLocal(db, "placements", PROJECT_ID, placementValues({ element: `Pier ${i}` }));
    const signOut = vi.fn(async () => undefined);

    const declined = vi.fn(() => false);
    expect(await signOutWithCheck({ confirm: declined, signOut })).toBe(false);
    expect(declined).toHaveBeenCalledWith(
      "3 changes have not reached the server yet. They stay on this device and will be sent the next time you sign in.",
    );
    expect(signOut).not.toHaveBeenCalled();
    expect((await readCurrentIdentity())?.id).toBe(db.userId);

    expect(await signOutWithCheck({ confirm: () => true, signOut })).toBe(true);
    expect(signOut).toHaveBeenCalledWith({ callbackUrl: "/signin" });
    expect(await readCurrentIdentity()).toBeNull();
    expect(await db.outbox.count()).toBe(3);
  });

  it("signing out with nothing waiting asks nothing", async () => {
    const db = await freshDb("dave");
    await rememberIdentity({ ...bob, id: db.userId });
    const confirm = vi.fn(() => true);
    const signOut = vi.fn(async () => undefined);
    expect(await signOutWithCheck({ confirm, signOut })).toBe(true);
    expect(confirm).not.toHaveBeenCalled();
    expect(signOut).toHaveBeenCalled();
  });

  it("words the warning for one change", () => {
    expect(unsyncedWarning(1)).toBe("1 change has not reached the server yet. It stays on this device and will be sent the next time you sign in.");
  });
});
