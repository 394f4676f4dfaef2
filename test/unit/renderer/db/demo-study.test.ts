import { IDBFactory, IDBKeyRange } from 'fake-indexeddb';
import { describe, expect, it } from 'vitest';
import type { GazeloomApi } from '../../../../app/contract';
import { createKeyring } from '../../../../app/core/crypto';
import { LabDatabase } from '../../../../renderer/db/lab-database';
import { LabStore } from '../../../../renderer/db/lab-store';
import { DEMO_PASSPHRASE, loadDemoStudyIfEmpty } from '../../../../renderer/console/lab/demo-study';
import { study } from './lab-records';

const audit = { operatorId: null, action: 'test', summary: '' };
const storeOnFreshDb = () => new LabStore(new LabDatabase('demo-test', { indexedDB: new IDBFactory(), IDBKeyRange }));
type DemoAnswer = Awaited<ReturnType<GazeloomApi['getDemoStudy']>>;
const hostSaying = (answer: DemoAnswer) => ({ getDemoStudy: async () => answer }) as unknown as GazeloomApi;

describe('the demo study on first open', () => {
  it('is loaded into an empty profile when the host has it ready, and waited for while it is built', async () => {
    const source = storeOnFreshDb();
    const { keyring } = await createKeyring(DEMO_PASSPHRASE, { demo: true });
    await source.put('settings', keyring, audit);
    await source.put('studies', { ...study, demo: true }, audit);
    const tables = await source.exportTables();

    const target = storeOnFreshDb();
    expect(await loadDemoStudyIfEmpty(hostSaying({ ok: true, value: { state: 'building' } }), target)).toBe('building');
    expect(await target.isEmpty()).toBe(true);
    expect(await loadDemoStudyIfEmpty(hostSaying({ ok: true, value: { state: 'ready', tables } }), target)).toBe('loaded');
    expect((await target.keyring())!.demo).toBe(true);
    expect((await target.get('studies', study.id))!.demo).toBe(true);
  });

  it('never touches a profile that holds anything', async () => {
    const store = storeOnFreshDb();
    await store.put('studies', study, audit);
    const host = { getDemoStudy: () => Promise.reject(new Error('must not be asked')) } as unknown as GazeloomApi;
    expect(await loadDemoStudyIfEmpty(host, store)).toBe('none');
    expect(await loadDemoStudyIfEmpty(hostSaying({ ok: true, value: { state: 'none' } }), storeOnFreshDb())).toBe('none');
  });
});
