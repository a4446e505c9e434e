import { Link } from "react-router";

/** An organisation's name, linked to its page where the viewer may open it (the loader asked the access policy). */
export function OrganisationName({ id, name, linked, className = "" }: { id: string; name: string; linked: boolean; className?: string }) {
  if (!linked) return <span className={className}>{name}</span>;
  return (
    <Link to={`/accounts/${id}`} className={`text-flow-700 hover:underline ${className}`}>
      {name}
    </Link>
  );
}
