// A photo from the phone's own store (or, for one taken elsewhere, the server's copy).
import { useEffect, useState } from 'react';
import type { DeviceDb, LocalPhoto } from '../../lib/device/db';

export function PhotoThumb({ db, photo, className = '' }: { db: DeviceDb; photo: LocalPhoto; className?: string }) {
  const [url, setUrl] = useState<string | null>(null);
  useEffect(() => {
    let objectUrl: string | null = null;
    let cancelled = false;
    void db.photoBlobs.get(photo.sha256).then((row) => {
      if (cancelled) return;
      if (row) {
        objectUrl = URL.createObjectURL(row.blob);
        setUrl(objectUrl);
      } else {
        setUrl(photo.remoteUrl);
      }
    });
    return () => {
      cancelled = true;
      if (objectUrl) URL.revokeObjectURL(objectUrl);
    };
  }, [db, photo.sha256, photo.remoteUrl]);
  if (!url) return <div className={`bg-ink/10 ${className}`} aria-label="Photo not on this phone" />;
  return <img src={url} alt={photo.caption || 'Photo from the visit'} className={`object-cover ${className}`} />;
}
