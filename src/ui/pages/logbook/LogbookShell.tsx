/** The frame of every Logbook route: Ionic page, toolbar title (with optional end buttons), padded content, main. */
import { IonButtons, IonContent, IonHeader, IonPage, IonTitle, IonToolbar } from '@ionic/react';
import type { ReactNode } from 'react';
import './logbook.css';

export function LogbookShell(props: { title: string; end?: ReactNode; children: ReactNode }) {
  return (
    <IonPage>
      <IonHeader>
        <IonToolbar>
          <IonTitle>{props.title}</IonTitle>
          {props.end ? <IonButtons slot="end">{props.end}</IonButtons> : null}
        </IonToolbar>
      </IonHeader>
      <IonContent className="ion-padding">
        <main>{props.children}</main>
      </IonContent>
    </IonPage>
  );
}
