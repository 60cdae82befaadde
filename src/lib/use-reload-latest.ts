import { useState } from 'react';

/**
 * The "Reload latest" offered after someone else saved first (a 409): `reload` fetches what is
 * saved now and starts the form again from it. `isReloading` lets the button say it is busy.
 */
export function useReloadLatest(reload: () => Promise<void>) {
  const [isReloading, setIsReloading] = useState(false);

  const reloadLatest = async () => {
    setIsReloading(true);
    try {
      await reload();
    } finally {
      setIsReloading(false);
    }
  };

  return { isReloading, reloadLatest: () => void reloadLatest() };
}
