import { OutboxMessageScreen } from '../../../components/screens/outbox-message-screen';

export default OutboxMessageScreen;
