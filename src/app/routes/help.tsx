import { useParams } from "react-router";
import { HELP_TOPICS } from "../../features/help/model/help-topics";
import { HelpIndex, HelpTopicPage } from "../../features/help/components/help-page";
import { useDocumentTitle } from "../../lib/use-document-title";
import { useSignedIn } from "../shell/session-context";
import { Component as NotFound } from "./not-found";

export function Component() {
  const { topic } = useParams();
  const { membership } = useSignedIn();
  const found = topic ? HELP_TOPICS.find((t) => t.id === topic) : undefined;
  useDocumentTitle(found ? `${found.title} · Help` : "Help");
  if (topic && !found) return <NotFound />;
  return found ? <HelpTopicPage topic={found} /> : <HelpIndex role={membership.role} />;
}
