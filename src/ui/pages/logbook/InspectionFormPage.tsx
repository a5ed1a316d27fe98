/**
 * `/logbook/inspection/new/:reflectorId` (a new inspection of one reflector) and `/logbook/inspection/:inspectionId`
 * (a stored one). A new form starts afresh each time the screen is entered.
 */
import { useIonViewWillEnter } from '@ionic/react';
import { useRef, useState } from 'react';
import { useParams } from 'react-router-dom';
import { EditInspection } from './EditInspection.tsx';
import { LogbookShell } from './LogbookShell.tsx';
import { NewInspection } from './NewInspection.tsx';

export function InspectionFormPage() {
  const { reflectorId, inspectionId } = useParams<{ reflectorId?: string; inspectionId?: string }>();
  const [session, setSession] = useState(0);
  const entered = useRef(false);
  useIonViewWillEnter(() => {
    if (entered.current) setSession((s) => s + 1);
    entered.current = true;
  });
  return (
    <LogbookShell title={inspectionId ? 'Inspection' : 'New inspection'}>
      {inspectionId ? <EditInspection key={inspectionId} id={inspectionId} /> : reflectorId ? <NewInspection key={`${reflectorId}-${session}`} reflectorId={reflectorId} /> : null}
    </LogbookShell>
  );
}
