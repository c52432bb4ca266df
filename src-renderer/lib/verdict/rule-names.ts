// Short names for the rule ids, for table rows and chart axes. The findings' own messages
// carry the full sentence.

const NAMES: Readonly<Record<string, string>> = {
  'controller-voltage': 'Controller voltage',
  'motor-voltage': 'Motor voltage',
  'motor-speed': 'Motor speed',
  'battery-continuous': 'Pack continuous current',
  'battery-burst': 'Pack burst current',
  'controller-continuous': 'Controller continuous current',
  'controller-burst': 'Controller burst current',
  'motor-current': 'Motor current',
  'motor-power': 'Motor power',
  'prop-tip-speed': 'Propeller tip speed',
  'supply-match': 'Packs matched in parallel',
  'pack-retired': 'Retired pack',
  'pack-repeated': 'Pack listed twice',
};

export function ruleName(rule: string): string {
  if (NAMES[rule]) return NAMES[rule];
  // Class rules are named by their shop or class: "class-max-voltage" → "Class: max voltage".
  if (rule.startsWith('class-')) return `Class: ${rule.slice(6).replace(/-/g, ' ')}`;
  return rule;
}
