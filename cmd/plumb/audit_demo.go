package main

// auditDemoData are the invented tables of the gallery's audit pairs
// (README "Audit") that the ferry data cannot show: thirty stops, and
// two freight series an order of magnitude apart. They are copies of
// testdata/audit/stops.csv and freight.csv, written beside the figure
// files of the gallery by writeDemoFigure.
var auditDemoData = map[string]string{
	"stops.csv": `stop,boardings
Gullton,9060
Holmton,8182
Gullford,7507
Caldford,6685
Oakwick,5872
Brackwick,5562
Ireby,4888
Mosswick,4464
Netherford,3957
Oakford,3671
Mossby,3203
Irewick,2737
Ashby,2488
Dunford,2350
Dunwick,1980
Pellford,1867
Caldwick,1626
Kelby,1627
Fenton,1311
Ireford,1167
Holmby,1029
Larkford,1049
Netherton,845
Ireton,805
Larkwick,1025
Holmwick,898
Larkton,865
Oakton,830
Pellmere,464
Ashwick,711
`,
	"freight.csv": `month,mainland_t,island_t
2023-01,11966,493
2023-02,13229,507
2023-03,13768,458
2023-04,14087,408
2023-05,12890,377
2023-06,12821,356
2023-07,12083,354
2023-08,11980,354
2023-09,10669,401
2023-10,11183,477
2023-11,11061,507
2023-12,11728,580
2024-01,12277,605
2024-02,13322,582
2024-03,13630,567
2024-04,14067,478
2024-05,14150,449
2024-06,13741,426
2024-07,12543,419
2024-08,11904,423
2024-09,11572,492
2024-10,11435,535
2024-11,11478,603
2024-12,12296,652
`,
}
