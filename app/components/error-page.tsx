import { Link } from "react-router";

const TEXT: Record<number, { title: string; body: string }> = {
  403: { title: "Not for your role", body: "Your account can't open this page. If you think it should, ask your administrator." },
  404: { title: "Nothing here", body: "This page or record doesn't exist, or it isn't shared with your organisation." },
  429: { title: "Too many requests", body: "Wait a moment, then try again." },
};

export function ErrorPage({ status, message, detail }: { status: number; message?: string; detail?: string }) {
  const text = TEXT[status] ?? { title: "Something went wrong", body: "We couldn't finish that. Try again in a moment." };
  return (
    <div className="mx-auto max-w-xl py-16 text-center">
      <p className="text-sm font-semibold text-flow-700">Error {status}</p>
      <h1 className="mt-2 text-3xl font-bold">{text.title}</h1>
      <p className="mt-4 text-ink-600">{status < 500 && message && message !== "Not found" ? message : text.body}</p>
      {detail ? <pre className="mt-6 overflow-auto rounded bg-ink-100 p-4 text-left text-xs">{detail}</pre> : null}
      <Link to="/" className="mt-8 inline-block font-semibold text-flow-700 hover:underline">
        Back to the start page
      </Link>
    </div>
  );
}
