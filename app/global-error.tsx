"use client";

export default function GlobalError({ error, reset }: { error: Error & { digest?: string }; reset: () => void }) {
  return (
    <html lang="en">
      <body style={{ fontFamily: "system-ui, sans-serif", padding: 32, background: "#faf7f2", color: "#1c2126" }}>
        <h1>Ovenward could not load</h1>
        <p>Something went wrong on the server. Try again; if it keeps happening, give your admin this reference: {error.digest ?? "none"}.</p>
        <button onClick={reset} style={{ minHeight: 44, padding: "0 16px" }}>
          Try again
        </button>
      </body>
    </html>
  );
}
