/**
 * Team register: server address and sign-in, the signed-in person and role, last successful sync, what is
 * waiting to go, each error in words, Sync now, sign out. Without a register the app works exactly as before.
 */
import { useState } from 'react';
import { useGlintmarkDb } from '../../../data/index.ts';
import { signIn, signOut, syncOnce, useSyncStatus } from '../../../sync/index.ts';
import { utcMinute } from './reports.ts';
import { messageOf } from './uiErrors.ts';

export function SyncSection() {
  const db = useGlintmarkDb();
  const status = useSyncStatus(db);
  const [url, setUrl] = useState<string | null>(null);
  const [email, setEmail] = useState('');
  const [password, setPassword] = useState('');
  const [deviceName, setDeviceName] = useState('');
  const [busy, setBusy] = useState(false);
  const [error, setError] = useState<string | null>(null);
  if (!status) return null;
  const run = async (op: () => Promise<unknown>) => {
    setBusy(true);
    setError(null);
    try {
      await op();
    } catch (e) {
      setError(messageOf(e));
    } finally {
      setBusy(false);
    }
  };
  const s = status.session;
  return (
    <section className="gm-section" aria-labelledby="sync-h" data-testid="sync">
      <h2 id="sync-h">Team register</h2>
      {s ? (
        <>
          <p data-testid="sync-signed-in">
            Signed in to <strong>{s.register.name}</strong> ({s.serverUrl}) as {s.member.email}, role {s.member.role}, this phone “{s.device.name}”.
          </p>
          <p data-testid="sync-last">{status.lastSyncAtMs !== null ? `Last successful sync ${utcMinute(status.lastSyncAtMs)}.` : 'Not synced yet.'}</p>
          <p data-testid="sync-waiting">
            Waiting to go: {status.waitingRecords} record{status.waitingRecords === 1 ? '' : 's'}, {status.waitingPhotos} photo{status.waitingPhotos === 1 ? '' : 's'}.
          </p>
          {status.lastError ? (
            <p className="gm-error" role="alert" data-testid="sync-error">
              {status.lastError.message}
            </p>
          ) : null}
          {status.refused.map((m, i) => (
            <p key={i} className="gm-error" data-testid={`sync-refused-${i}`}>
              {m}
            </p>
          ))}
          {status.photoProblems.map((m, i) => (
            <p key={i} className="gm-note" data-testid={`sync-photo-problem-${i}`}>
              {m}
            </p>
          ))}
          <button type="button" className="gm-btn gm-primary" disabled={busy} onClick={() => void run(() => syncOnce(db))} data-testid="sync-now">
            {busy ? 'Syncing…' : 'Sync now'}
          </button>{' '}
          <a className="gm-btn" href="/register" data-testid="open-register">
            Register overview
          </a>{' '}
          <button type="button" className="gm-btn" disabled={busy} onClick={() => void run(() => signOut(db))} data-testid="sync-sign-out">
            Sign out
          </button>
        </>
      ) : (
        <form
          onSubmit={(e) => {
            e.preventDefault();
            void run(() => signIn(db, url ?? status.serverUrl ?? '', email, password, deviceName).then(() => syncOnce(db)));
          }}
        >
          <p className="gm-note">Optional: sync this phone with your team’s register. Records always stay on the phone; without a register nothing is sent anywhere.</p>
          <label>
            Register address <input value={url ?? status.serverUrl ?? ''} onChange={(e) => setUrl(e.target.value)} placeholder="http://192.168.1.20:7206" data-testid="sync-url" />
          </label>
          <label>
            Email <input type="email" value={email} onChange={(e) => setEmail(e.target.value)} autoComplete="username" data-testid="sync-email" />
          </label>
          <label>
            Password <input type="password" value={password} onChange={(e) => setPassword(e.target.value)} autoComplete="current-password" data-testid="sync-password" />
          </label>
          <label>
            Name of this phone <input value={deviceName} onChange={(e) => setDeviceName(e.target.value)} placeholder="crew phone 2" data-testid="sync-device" />
          </label>
          <button type="submit" className="gm-btn gm-primary" disabled={busy} data-testid="sync-sign-in">
            {busy ? 'Signing in…' : 'Sign in'}
          </button>
          {status.lastError ? <p className="gm-note">{status.lastError.message}</p> : null}
        </form>
      )}
      {error ? (
        <p className="gm-error" role="alert" data-testid="sync-action-error">
          {error}
        </p>
      ) : null}
    </section>
  );
}
