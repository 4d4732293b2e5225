import { MessagePage } from "./_components/message-page";

export default function NotFound() {
  return <MessagePage title="Nothing here">This page does not exist, or it was moved.</MessagePage>;
}
