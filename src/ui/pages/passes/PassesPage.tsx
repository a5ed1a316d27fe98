import { IonContent, IonHeader, IonPage, IonTitle, IonToolbar } from '@ionic/react';

export function PassesPage() {
  return (
    <IonPage>
      <IonHeader>
        <IonToolbar>
          <IonTitle>Passes</IonTitle>
        </IonToolbar>
      </IonHeader>
      <IonContent className="ion-padding">
        <main>
          <h1 className="gm-label">Passes</h1>
          <p>Upcoming radar passes over the site from the satellite's orbital elements, grouped into tracks, with a countdown and a sky plot against the reflector's beam.</p>
        </main>
      </IonContent>
    </IonPage>
  );
}
