// The bucket's CORS rule: browsers upload straight to object storage from the app's origin.

function escapeXml(s: string): string {
  return s.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;').replace(/"/g, '&quot;');
}

export function appOrigins(appPort: number): string[] {
  return [`http://localhost:${appPort}`, `http://127.0.0.1:${appPort}`];
}

export function corsXml(origins: string[]): string {
  const allowed = origins.map((o) => `    <AllowedOrigin>${escapeXml(o)}</AllowedOrigin>`).join('\n');
  return [
    '<CORSConfiguration>',
    '  <CORSRule>',
    allowed,
    '    <AllowedMethod>GET</AllowedMethod>',
    '    <AllowedMethod>PUT</AllowedMethod>',
    '    <AllowedMethod>HEAD</AllowedMethod>',
    '    <AllowedHeader>*</AllowedHeader>',
    '    <ExposeHeader>ETag</ExposeHeader>',
    '    <MaxAgeSeconds>3000</MaxAgeSeconds>',
    '  </CORSRule>',
    '</CORSConfiguration>',
  ].join('\n');
}
