import { useEffect, useState } from 'react';
import QRCode from 'qrcode';

/** A share link as a QR code (SVG text from the `qrcode` package, drawn as an image: no markup injected). */
export function LinkQr({ url }: { url: string }) {
  const [src, setSrc] = useState<string | null>(null);
  useEffect(() => {
    let stop = false;
    QRCode.toString(url, { type: 'svg', margin: 1, errorCorrectionLevel: 'M', color: { dark: '#0b0f14', light: '#f8fafc' } })
      .then((svg) => { if (!stop) setSrc(`data:image/svg+xml;charset=utf-8,${encodeURIComponent(svg)}`); })
      .catch(() => setSrc(null));
    return () => { stop = true; };
  }, [url]);
  if (!src) return null;
  return <img src={src} alt="QR code of the share link" data-testid="share-qr" className="h-40 w-40 rounded bg-slate-50 p-1" />;
}
