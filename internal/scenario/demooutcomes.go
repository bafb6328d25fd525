package scenario

// DemoOutcomes is an outcomes file of fictional simulation runs, invented
// by cloudwind to show how scores and overlays read: none is a real run or
// a published result, and its source column says so. `cloudwind eval
// --outcomes demo` and the explorer load it by that name.
const DemoOutcomes = `# cloudwind demo outcomes: FICTIONAL runs with invented outcomes, for showing the scores only
chi,mach,pressure,t_cloud,r_cl,outcome,label,source
100,1.5,1000,1e4,1,destroyed,demo A,fictional (cloudwind demo)
100,1.5,1000,1e4,3,destroyed,demo B,fictional (cloudwind demo)
100,1.5,1000,1e4,10,survived,demo C,fictional (cloudwind demo)
100,1.5,1000,1e4,30,grew,demo D,fictional (cloudwind demo)
100,1.5,1000,1e4,100,grew,demo E,fictional (cloudwind demo)
300,1,1000,1e4,10,destroyed,demo F,fictional (cloudwind demo)
300,1,1000,1e4,100,grew,demo G,fictional (cloudwind demo)
1000,1,1e4,1e4,10,destroyed,demo H,fictional (cloudwind demo)
1000,1,1e4,1e4,300,grew,demo I,fictional (cloudwind demo)
3000,1,1e4,800,3,transformed,demo J,fictional (cloudwind demo)
3000,1,1e4,800,0.3,destroyed,demo K,fictional (cloudwind demo)
3000,1,1e4,800,30,grew,demo L,fictional (cloudwind demo)
`

// DemoOutcomesName is the name that selects DemoOutcomes instead of a file.
const DemoOutcomesName = "demo"
