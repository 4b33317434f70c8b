/**
 * The demo panel (invented): four regional bakeries, twelve quarters of ad spend (EUR) and market
 * share. The same text as scenarios/regional-bakeries.csv (a test keeps them equal), so the web
 * Calibrate page can offer it without reading files.
 */
export const DEMO_PANEL = {
  file: "regional-bakeries.csv",
  title: "Four regional bakeries: ad spend and market share",
  currency: "EUR",
  csv: `quarter_label,period,rival,spend,share,region
2023 Q1,2023-Q1,Larkspur Bakehouse,18000,25.4%,North
2023 Q1,2023-Q1,Millstone Loaves,19600,37.2%,Central
2023 Q1,2023-Q1,Hearth & Crumb,8000,11.8%,Harbour
2023 Q1,2023-Q1,Copperpan Patisserie,16300,25.6%,East
2023 Q2,2023-Q2,Larkspur Bakehouse,24300,32.5%,North
2023 Q2,2023-Q2,Millstone Loaves,28300,37.2%,Central
2023 Q2,2023-Q2,Hearth & Crumb,5400,7.9%,Harbour
2023 Q2,2023-Q2,Copperpan Patisserie,17000,22.4%,East
2023 Q3,2023-Q3,Larkspur Bakehouse,19600,20.7%,North
2023 Q3,2023-Q3,Millstone Loaves,58800,45.2%,Central
2023 Q3,2023-Q3,Hearth & Crumb,7300,10.3%,Harbour
2023 Q3,2023-Q3,Copperpan Patisserie,21100,23.8%,East
2023 Q4,2023-Q4,Larkspur Bakehouse,20900,23.9%,North
2023 Q4,2023-Q4,Millstone Loaves,31300,40.7%,Central
2023 Q4,2023-Q4,Hearth & Crumb,12100,11.5%,Harbour
2023 Q4,2023-Q4,Copperpan Patisserie,24600,23.9%,East
2024 Q1,2024-Q1,Larkspur Bakehouse,14800,20.5%,North
2024 Q1,2024-Q1,Millstone Loaves,31400,40.4%,Central
2024 Q1,2024-Q1,Hearth & Crumb,7700,11.2%,Harbour
2024 Q1,2024-Q1,Copperpan Patisserie,27100,27.9%,East
2024 Q2,2024-Q2,Larkspur Bakehouse,24900,25.0%,North
2024 Q2,2024-Q2,Millstone Loaves,49600,45.7%,Central
2024 Q2,2024-Q2,Hearth & Crumb,9300,10.3%,Harbour
2024 Q2,2024-Q2,Copperpan Patisserie,13600,19.0%,East
2024 Q3,2024-Q3,Larkspur Bakehouse,21600,22.2%,North
2024 Q3,2024-Q3,Millstone Loaves,34200,42.4%,Central
2024 Q3,2024-Q3,Hearth & Crumb,7300,8.9%,Harbour
2024 Q3,2024-Q3,Copperpan Patisserie,24900,26.4%,East
2024 Q4,2024-Q4,Larkspur Bakehouse,37400,28.0%,North
2024 Q4,2024-Q4,Millstone Loaves,44600,41.2%,Central
2024 Q4,2024-Q4,Hearth & Crumb,10600,10.6%,Harbour
2024 Q4,2024-Q4,Copperpan Patisserie,23000,20.2%,East
2025 Q1,2025-Q1,Larkspur Bakehouse,18200,26.4%,North
2025 Q1,2025-Q1,Millstone Loaves,24700,39.8%,Central
2025 Q1,2025-Q1,Hearth & Crumb,9800,14.1%,Harbour
2025 Q1,2025-Q1,Copperpan Patisserie,8600,19.7%,East
2025 Q2,2025-Q2,Larkspur Bakehouse,20800,24.6%,North
2025 Q2,2025-Q2,Millstone Loaves,30000,35.2%,Central
2025 Q2,2025-Q2,Hearth & Crumb,12800,13.6%,Harbour
2025 Q2,2025-Q2,Copperpan Patisserie,23100,26.6%,East
2025 Q3,2025-Q3,Larkspur Bakehouse,18300,21.5%,North
2025 Q3,2025-Q3,Millstone Loaves,52400,50.5%,Central
2025 Q3,2025-Q3,Hearth & Crumb,8400,9.9%,Harbour
2025 Q3,2025-Q3,Copperpan Patisserie,14300,18.1%,East
2025 Q4,2025-Q4,Larkspur Bakehouse,21100,20.9%,North
2025 Q4,2025-Q4,Millstone Loaves,36000,38.8%,Central
2025 Q4,2025-Q4,Hearth & Crumb,18500,14.2%,Harbour
2025 Q4,2025-Q4,Copperpan Patisserie,25500,26.2%,East
`,
} as const;
