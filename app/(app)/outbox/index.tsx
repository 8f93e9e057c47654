import { OutboxScreen } from '../../../components/screens/outbox-screen';

export default OutboxScreen;
