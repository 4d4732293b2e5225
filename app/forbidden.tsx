import { MessagePage } from "./_components/message-page";

export default function Forbidden() {
  return (
    <MessagePage title="Not for your role">
      Your account does not hold a role that may open this page. Ask your group&apos;s admin if you need it.
    </MessagePage>
  );
}
