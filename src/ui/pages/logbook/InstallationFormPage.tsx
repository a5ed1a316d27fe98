/**
 * `/logbook/new-installation` (from the Align capture and the plan) and `/logbook/installation/:installationId`
 * (a stored one). A new form starts afresh when the crew comes back after saving one.
 */
import { useIonViewWillEnter } from '@ionic/react';
import { useRef, useState } from 'react';
import { useParams } from 'react-router-dom';
import { EditInstallation } from './EditInstallation.tsx';
import { LogbookShell } from './LogbookShell.tsx';
import { NewInstallation } from './NewInstallation.tsx';

export function InstallationFormPage() {
  const { installationId } = useParams<{ installationId?: string }>();
  const [session, setSession] = useState(0);
  const savedRef = useRef(false);
  useIonViewWillEnter(() => {
    if (!savedRef.current) return;
    savedRef.current = false;
    setSession((s) => s + 1);
  });
  return (
    <LogbookShell title={installationId ? 'Installation' : 'New installation'}>
      {installationId ? (
        <EditInstallation key={installationId} id={installationId} />
      ) : (
        <>
          <h1 className="gm-label">Record the installation</h1>
          <NewInstallation key={session} onSaved={() => (savedRef.current = true)} />
        </>
      )}
    </LogbookShell>
  );
}
