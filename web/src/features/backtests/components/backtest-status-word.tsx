import { StatusWord } from '../../../components/ui/status-word';
import type { BacktestStatus } from '../types';
import { BACKTEST_STATUS } from '../utils/backtest-words';

export function BacktestStatusWord({ status }: { status: BacktestStatus }) {
  return <StatusWord tone={BACKTEST_STATUS[status].tone} label={BACKTEST_STATUS[status].word} />;
}
