import { StateMessage } from '../../../components/ui/state-message';

/** Panels the posts and parts issues fill; until then each says what will show here. */
export function UnansweredPostsPanel() {
  return (
    <StateMessage kind="empty" title="No unanswered posts.">
      <p>Questions and suggestions from readers that wait for an answer from the build team show here.</p>
    </StateMessage>
  );
}

export function PartsOnOrderPanel() {
  return (
    <StateMessage kind="empty" title="No parts on order.">
      <p>Part lines marked “on order” show here until they arrive, with the open item they hold up.</p>
    </StateMessage>
  );
}
